import { numberInRange } from './guards';

/** Syrup hydrometers in the trade are calibrated at 60 °F (15.6 °C). */
export const HYDROMETER_CALIBRATION_C = ((60 - 32) * 5) / 9;

/** Finished-syrup °Brix range the hot-test correction is used for. */
export const HYDROMETER_BRIX_RANGE = { min: 60, max: 70 } as const;
/** Syrup temperatures the correction chart covers (°C): 50 °F to boiling. */
export const HYDROMETER_TEMP_RANGE_C = { min: 10, max: 110 } as const;

/**
 * Maple syrup density chart for hydrometers calibrated at 60 °F (Vermont Agency of
 * Agriculture, Food & Markets, maple products rules): the reading that syrup of
 * 66.9 °Brix (36 °Baumé, modulus 145, at 60 °F) gives at each syrup temperature.
 * Rows: [°F, °Baumé, °Brix]. The chart's top row applies at 209 °F and above.
 */
export const VERMONT_DENSITY_CHART: ReadonlyArray<readonly [number, number, number]> = Object.freeze([
  [50, 36.25, 67.4],
  [60, 36.0, 66.9],
  [70, 35.75, 66.4],
  [80, 35.5, 65.9],
  [90, 35.25, 65.4],
  [100, 35.0, 64.8],
  [110, 34.75, 64.3],
  [120, 34.5, 63.8],
  [130, 34.25, 63.3],
  [140, 34.0, 62.8],
  [149, 33.75, 62.3],
  [158, 33.5, 61.8],
  [167, 33.25, 61.4],
  [176, 33.0, 60.9],
  [185, 32.75, 60.4],
  [193, 32.5, 60.0],
  [202, 32.25, 59.6],
  [209, 32.0, 59.0],
] as const);

const CHART_BRIX = 66.9;

/**
 * What a syrup hydrometer calibrated at 60 °F reads (°Brix scale) in syrup of `brix`
 * (true °Brix) at `tempC`. Hot syrup is less dense, so the hydrometer sinks deeper and
 * reads low: the hot-test correction. The correction at each temperature is taken from
 * {@link VERMONT_DENSITY_CHART} (linear between its rows, the top row from 209 °F up),
 * applied as an offset to the co-op's finishing °Brix (60–70).
 */
export function hydrometerReadingBrix(brix: number, tempC: number): number {
  numberInRange('brix', brix, HYDROMETER_BRIX_RANGE.min, HYDROMETER_BRIX_RANGE.max);
  numberInRange('tempC', tempC, HYDROMETER_TEMP_RANGE_C.min, HYDROMETER_TEMP_RANGE_C.max);
  const f = (tempC * 9) / 5 + 32;
  const rows = VERMONT_DENSITY_CHART;
  const last = rows[rows.length - 1];
  let reading = last[2];
  if (f < last[0]) {
    let i = 0;
    while (rows[i + 1][0] <= f) i++;
    const [f0, , b0] = rows[i];
    const [f1, , b1] = rows[i + 1];
    reading = b0 + ((b1 - b0) * (f - f0)) / (f1 - f0);
  }
  return brix + (reading - CHART_BRIX);
}
