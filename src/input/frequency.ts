/** A test frequency (DMA): a bare number is Hz, text may say Hz, kHz or mHz; parsed to Hz. */
import { InputError } from '../base/errors.js';
import { showRaw, type Quantity } from './quantity.js';

/** Range of a DMA test frequency, Hz (instruments run from about 0.01 to 100 Hz; common practice), with a decade of margin. */
export const FREQUENCY_RANGE_HZ: readonly [number, number] = [1e-4, 1e4];

const WHAT = 'a frequency (a number in Hz, or text such as "1 Hz" or "10 Hz")';
/** "mHz" is millihertz (the SI symbol; megahertz is not a DMA frequency), matched before case is folded. */
const FACTORS: Record<string, number> = { hz: 1, khz: 1e3 };

/** A test frequency inside FREQUENCY_RANGE_HZ; parsed to Hz. */
export const frequencyInput: Quantity<number> = {
  what: WHAT,
  unit: 'Hz',
  min: FREQUENCY_RANGE_HZ[0],
  max: FREQUENCY_RANGE_HZ[1],
  parse(raw, name) {
    let hz: number;
    if (typeof raw === 'number') hz = raw;
    else {
      const m = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*([a-zA-Z]*)\s*$/.exec(raw);
      const unit = m?.[2] ?? '';
      const factor = m ? (unit === '' ? 1 : unit === 'mHz' ? 1e-3 : FACTORS[unit.toLowerCase()]) : undefined;
      if (!m || factor === undefined) throw new InputError(name, `expects ${WHAT}, got ${showRaw(raw)}`);
      hz = Number(m[1]) * factor;
    }
    if (!Number.isFinite(hz) || hz <= 0) throw new InputError(name, `must be greater than zero, got ${showRaw(raw)}`);
    if (hz < FREQUENCY_RANGE_HZ[0] || hz > FREQUENCY_RANGE_HZ[1]) {
      throw new InputError(name, `${showRaw(raw)} is outside ${FREQUENCY_RANGE_HZ[0]} to ${FREQUENCY_RANGE_HZ[1]} Hz`);
    }
    return hz;
  },
};
