'use client';

import { useId, useState } from 'react';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { celsiusToFahrenheit, drawOffTargetC, hydrometerReadingBrix, waterBoilingPointC, type UnitSystem } from '@/lib/sugar';
import { formatBrix, formatTemperature } from '@/lib/format/units';

interface DrawOffCalculatorProps {
  elevationM: number;
  /** The co-op's finishing density, °Brix. */
  finishBrix: number;
  unitSystem: UnitSystem;
}

const KPA_PER_INHG = 3.386389;
/** Grade A runs from 66.0 to 68.9 °Brix (USDA 2015); the table walks that range. */
const GRADE_A_BRIX = [66.0, 66.5, 66.9, 67.5, 68.0, 68.5, 68.9];
const ROOM_C = 20;

function aboveWater(targetC: number, waterC: number, units: UnitSystem): string {
  const delta = units === 'us' ? celsiusToFahrenheit(targetC) - celsiusToFahrenheit(waterC) : targetC - waterC;
  return `+${delta.toFixed(1)} ${units === 'us' ? '°F' : '°C'}`;
}

/**
 * Today's draw-off target from the barometer in the sugarhouse (station pressure, not the
 * sea-level figure of a weather report) and the co-op's finishing °Brix; a thermometer
 * check, the hydrometer or refractometer decides.
 */
export function DrawOffCalculator({ elevationM, finishBrix, unitSystem }: DrawOffCalculatorProps) {
  const id = useId();
  const [unit, setUnit] = useState<'kPa' | 'inHg'>(unitSystem === 'us' ? 'inHg' : 'kPa');
  const [reading, setReading] = useState('');
  const value = Number(reading.replace(',', '.'));
  const kPa = reading && Number.isFinite(value) ? (unit === 'inHg' ? value * KPA_PER_INHG : value) : null;
  const valid = kPa !== null && kPa >= 60 && kPa <= 110;
  const error = reading && !valid ? `Enter the station pressure, ${unit === 'inHg' ? '17.7–32.5 inHg' : '60–110 kPa'}.` : undefined;
  const place = valid ? { pressureKPa: kPa! } : { elevationM };
  const water = waterBoilingPointC(place);
  const target = drawOffTargetC({ ...place, finishBrix });
  const rows = [...new Set([...GRADE_A_BRIX, finishBrix])].sort((a, b) => a - b);
  const hot = hydrometerReadingBrix(finishBrix, Math.min(target, 110));
  const room = hydrometerReadingBrix(finishBrix, ROOM_C);
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-[1fr_8rem]">
        <Field label="Barometer in the sugarhouse now" htmlFor={`${id}-p`} error={error} hint="Leave empty to use the standard atmosphere at the sugarhouse’s elevation.">
          <Input {...fieldA11y(`${id}-p`, error, true)} inputMode="decimal" value={reading} onChange={(e) => setReading(e.target.value)} />
        </Field>
        <Field label="Unit" htmlFor={`${id}-u`}>
          <Select id={`${id}-u`} value={unit} onChange={(e) => setUnit(e.target.value as 'kPa' | 'inHg')}>
            <option value="kPa">kPa</option>
            <option value="inHg">inHg</option>
          </Select>
        </Field>
      </div>
      <dl className="grid grid-cols-2 gap-3">
        <div className="rounded-lg bg-birch p-3">
          <dt className="text-sm text-slate-muted">Water boils at</dt>
          <dd className="text-2xl font-bold" data-testid="water-boiling-point">{formatTemperature(water, unitSystem)}</dd>
        </div>
        <div className="rounded-lg bg-ember-soft p-3">
          <dt className="text-sm text-slate-muted">Draw off {formatBrix(finishBrix)} syrup at</dt>
          <dd className="text-2xl font-bold text-ember-strong" data-testid="draw-off-target">{formatTemperature(target, unitSystem)}</dd>
        </div>
      </dl>
      <p className="text-sm text-slate-muted" data-testid="hydrometer-readings">
        Hydrometer check (scale calibrated at {unitSystem === 'us' ? '60 °F' : '15.6 °C'}): {formatBrix(finishBrix)} syrup reads{' '}
        <strong className="text-slate">{formatBrix(hot)}</strong> hot, straight from the draw-off, and{' '}
        <strong className="text-slate">{formatBrix(room)}</strong> at room temperature ({formatTemperature(ROOM_C, unitSystem, { digits: 0 })}). Hot-test
        correction from the Vermont maple density chart for hydrometers calibrated at 60 °F.
      </p>
      <Table label="Draw-off target by finishing density" data-testid="draw-off-table">
        <caption className="px-3 pt-2.5 text-left text-sm text-slate-muted">How the target moves across Grade A density</caption>
        <THead>
          <TR>
            <TH>Finishing density</TH>
            <TH numeric>Draw off at</TH>
            <TH numeric>Above water</TH>
          </TR>
        </THead>
        <TBody>
          {rows.map((brix) => {
            const t = drawOffTargetC({ ...place, finishBrix: brix });
            const ours = brix === finishBrix;
            return (
              <TR key={brix} className={ours ? 'bg-ember-soft font-semibold' : undefined} aria-current={ours ? 'true' : undefined}>
                <TD>
                  {formatBrix(brix)}
                  {ours ? ' (target)' : ''}
                </TD>
                <TD numeric>{formatTemperature(t, unitSystem)}</TD>
                <TD numeric>{aboveWater(t, water, unitSystem)}</TD>
              </TR>
            );
          })}
        </TBody>
      </Table>
    </div>
  );
}
