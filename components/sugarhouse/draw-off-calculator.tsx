'use client';

import { useId, useState } from 'react';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { drawOffTemperatureC, formatTemperature, waterBoilingPointC, type UnitSystem } from '@/lib/sugar';

interface DrawOffCalculatorProps {
  elevationM: number;
  offsetC: number;
  unitSystem: UnitSystem;
}

const KPA_PER_INHG = 3.386389;

/**
 * Today's draw-off target from the barometer in the sugarhouse (station pressure, not the
 * sea-level figure of a weather report); a thermometer check, the hydrometer or refractometer decides.
 */
export function DrawOffCalculator({ elevationM, offsetC, unitSystem }: DrawOffCalculatorProps) {
  const id = useId();
  const [unit, setUnit] = useState<'kPa' | 'inHg'>(unitSystem === 'us' ? 'inHg' : 'kPa');
  const [reading, setReading] = useState('');
  const value = Number(reading.replace(',', '.'));
  const kPa = reading && Number.isFinite(value) ? (unit === 'inHg' ? value * KPA_PER_INHG : value) : null;
  const valid = kPa !== null && kPa >= 60 && kPa <= 110;
  const error = reading && !valid ? `Enter the station pressure, ${unit === 'inHg' ? '17.7–32.5 inHg' : '60–110 kPa'}.` : undefined;
  const place = valid ? { pressureKPa: kPa! } : { elevationM };
  const water = waterBoilingPointC(place);
  const target = drawOffTemperatureC(place, offsetC);
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
          <dt className="text-sm text-slate-muted">Draw off syrup at</dt>
          <dd className="text-2xl font-bold text-ember-strong" data-testid="draw-off-target">{formatTemperature(target, unitSystem)}</dd>
        </div>
      </dl>
    </div>
  );
}
