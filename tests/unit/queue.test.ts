import { describe, expect, it } from 'vitest';
import { computeQueue, type QueueInput, type WaitingLotInput } from '@/lib/queue/rules';
import { boilHours, SPOILAGE_DEFAULTS } from '@/lib/sugar';

const now = new Date('2027-03-10T15:00:00Z');
const H = 3_600_000;
const at = (hours: number) => new Date(now.getTime() + hours * H);

function lot(id: string, over: Partial<WaitingLotInput> = {}): WaitingLotInput {
  return {
    deliveryId: id,
    householdId: `h-${id}`,
    householdName: `Household ${id}`,
    receivedAt: at(-10),
    collectedOn: '2027-03-09',
    collectedAt: at(-24),
    litresLeft: 300,
    brix: 2.0,
    sapTempC: 3,
    ...over,
  };
}

function input(over: Partial<QueueInput> = {}): QueueInput {
  return {
    version: 7,
    now,
    evaporator: { id: 'e1', name: 'Main evaporator', evaporationLph: 150 },
    syrupBrix: 66.9,
    spoilage: { ...SPOILAGE_DEFAULTS },
    lots: [],
    run: null,
    bookedSlots: [],
    syrupDrawnTodayL: 0,
    ...over,
  };
}

describe('the boil queue', () => {
  it('orders lots by spoilage deadline, then by arrival', () => {
    const snap = computeQueue(
      input({
        lots: [
          // Cold, collected 1 day ago: deadline in 6 days; arrived 2 h ago.
          lot('late-arrival', { receivedAt: at(-2) }),
          // Same collection and temperature, arrived earlier: same deadline, goes first.
          lot('early-arrival', { receivedAt: at(-20) }),
          // Collected only 5 h ago but arrived warm (12 °C > 7 °C): 3-day shelf life, so its deadline is earliest.
          lot('warm', { collectedAt: at(-5), receivedAt: at(-1), sapTempC: 12 }),
        ],
      }),
    );
    expect(snap.lots.map((l) => l.deliveryId)).toEqual(['warm', 'early-arrival', 'late-arrival']);
    expect(snap.lots[0].deadline).toBe(at(-5 + 3 * 24).toISOString());
    expect(snap.lots[1].deadline).toBe(at(-24 + 7 * 24).toISOString());
    expect(snap.lots[1].ageHours).toBeCloseTo(24, 9);
    expect(snap.version).toBe(7);
  });

  it('gives each lot a start and end that add up lib/sugar boilHours one lot after another', () => {
    const lots = [lot('a', { litresLeft: 1500, brix: 2.0, collectedAt: at(-48) }), lot('b', { litresLeft: 800, brix: 3.1 }), lot('c', { litresLeft: 420.5, brix: 1.4, collectedAt: at(-2) })];
    const snap = computeQueue(input({ lots }));
    let clock = now.getTime();
    expect(snap.lots.map((l) => l.deliveryId)).toEqual(['a', 'b', 'c']);
    for (const l of snap.lots) {
      const source = lots.find((x) => x.deliveryId === l.deliveryId)!;
      const hours = boilHours(source.litresLeft, source.brix, 150, 66.9);
      expect(l.etaStart).toBe(new Date(clock).toISOString());
      clock += hours * H;
      expect(l.etaEnd).toBe(new Date(clock).toISOString());
      expect(l.boilHours).toBeCloseTo(hours, 12);
    }
    // Independent check of the first lot: 1500 L of 2.0 °Bx sap weighs 1500 × 1.0060 kg (CRC Handbook of
    // Chemistry and Physics, "Concentrative properties of aqueous solutions", sucrose at 20 °C); the sugar,
    // 30.18 kg, leaves as 45.11 kg of 66.9 °Bx syrup, so 1463.9 kg of water boils off: 9.76 h at 150 L/h.
    expect(snap.lots[0].boilHours).toBeCloseTo(9.759, 2);
    expect(snap.totals.hoursNeeded).toBeCloseTo((clock - now.getTime()) / H, 9);
    expect(snap.totals.litresWaiting).toBeCloseTo(2720.5, 9);
    expect(snap.totals.lots).toBe(3);
  });

  it('starts the queue when the running run has boiled the sap it took in', () => {
    const run = {
      id: 'r1',
      lotCode: '2027-004',
      evaporatorId: 'e1',
      evaporatorName: 'Main evaporator',
      evaporationLph: 150,
      startedAt: at(-1),
      inputs: [{ litres: 600, brix: 2.2 }, { litres: 300, brix: 1.8 }],
      draws: [{ id: 'd1', drawnAt: at(-0.25), litres: 4.5, brix: 66.9, transmittancePct: 62, gradeClass: 'amber' as const }],
    };
    const snap = computeQueue(input({ lots: [lot('a')], run }));
    const runNeeds = boilHours(600, 2.2, 150, 66.9) + boilHours(300, 1.8, 150, 66.9);
    expect(snap.run!.hoursLeft).toBeCloseTo(runNeeds - 1, 9);
    expect(snap.lots[0].etaStart).toBe(new Date(now.getTime() + (runNeeds - 1) * H).toISOString());
    expect(snap.run!.inputL).toBe(900);
    expect(snap.run!.syrupDrawnL).toBe(4.5);
    expect(snap.run!.syrupExpectedL).toBeGreaterThan(snap.run!.syrupDrawnL);
  });

  it('flags a lot that will spoil before its turn, and only that one', () => {
    const snap = computeQueue(
      input({
        lots: [
          // Deadline in 40 h; 4000 L at 2 °Bx needs about 26 h, so it finishes in time.
          lot('big', { litresLeft: 4000, collectedAt: at(-168 + 40) }),
          // Deadline in 30 h but it waits behind nothing: ordered first, needs 2 h.
          lot('small-first', { litresLeft: 450, collectedAt: at(-168 + 30) }),
          // Deadline in 45 h, but its turn starts only after ~28 h of boiling and it needs ~40 h: spoils first.
          lot('too-late', { litresLeft: 6000, brix: 1.6, collectedAt: at(-168 + 45) }),
          // A week of shelf life left: fine.
          lot('fresh', { litresLeft: 100, collectedAt: at(-1) }),
        ],
      }),
    );
    const flagged = Object.fromEntries(snap.lots.map((l) => [l.deliveryId, l.spoilsBeforeTurn]));
    expect(snap.lots.map((l) => l.deliveryId)).toEqual(['small-first', 'big', 'too-late', 'fresh']);
    expect(flagged).toEqual({ 'small-first': false, big: false, 'too-late': true, fresh: false });
    expect(snap.totals.atRisk).toBe(1);
    expect(snap.lots.find((l) => l.deliveryId === 'small-first')!.state).toBe('watch');
    expect(snap.lots.find((l) => l.deliveryId === 'fresh')!.state).toBe('fresh');
  });

  it('leaves out lots with nothing left and counts only booked hours from now on', () => {
    const snap = computeQueue(
      input({
        lots: [lot('done', { litresLeft: 0 }), lot('left', { litresLeft: 120 })],
        bookedSlots: [
          { startsAt: at(-2), endsAt: at(3) },
          { startsAt: at(20), endsAt: at(26) },
        ],
      }),
    );
    expect(snap.lots.map((l) => l.deliveryId)).toEqual(['left']);
    expect(snap.totals.hoursBookedAhead).toBeCloseTo(9, 9);
  });
});
