/** A test frequency (DMA): a bare number is Hz, text may say Hz, kHz or mHz; parsed to Hz. */
import { InputError } from '../base/errors.js';
import { showRaw, type Quantity, trimmed } from './quantity.js';

/** Range of a DMA test frequency, Hz (instruments run from about 0.01 to 100 Hz; common practice), with a decade of margin. */
const MIN_HZ = 1e-4;
const MAX_HZ = 1e4;
export const FREQUENCY_RANGE_HZ: readonly [number, number] = [MIN_HZ, MAX_HZ];

const WHAT = 'a frequency (a number in Hz, or text such as "1 Hz" or "10 Hz")';
/** "mHz" is millihertz (the SI symbol; megahertz is not a DMA frequency), matched before case is folded. */
const FACTORS: Record<string, number> = { hz: 1, khz: 1e3 };

// Plain constants, not the tuple: a member access at module level keeps the object in bundles that do not use it.
/** A test frequency inside FREQUENCY_RANGE_HZ; parsed to Hz. */
export const frequencyInput: Quantity<number> = {
  what: WHAT,
  unit: 'Hz',
  min: MIN_HZ,
  max: MAX_HZ,
  parse(input, name) {
    const raw = trimmed(input);
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
    if (hz < MIN_HZ || hz > MAX_HZ) {
      throw new InputError(name, `${showRaw(raw)} is outside ${MIN_HZ} to ${MAX_HZ} Hz`);
    }
    return hz;
  },
};
