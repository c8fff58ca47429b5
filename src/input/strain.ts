/** Strain: a bare number is a fraction (0.005), text may be a percentage ("0.5 %"). */
import { InputError } from '../base/errors.js';
import { MAX_STRAIN } from '../answers/stress.js';
import { decimalNumber, showRaw, type Quantity, trimmed } from './quantity.js';

const WHAT = 'a strain (a fraction such as 0.005, or text such as "0.5 %")';

/** A strain greater than zero and at most MAX_STRAIN (answers/stress.ts, 10 %: the model is linear viscoelastic); a fraction. */
export const strainInput: Quantity<number> = {
  what: WHAT,
  unit: 'fraction',
  min: 0,
  max: MAX_STRAIN,
  parse(input, name) {
    const raw = trimmed(input);
    let x: number;
    if (typeof raw === 'number') x = raw;
    else {
      const t = raw.trim();
      const percent = t.endsWith('%');
      const n = decimalNumber(percent ? t.slice(0, -1) : t);
      if (n === undefined) throw new InputError(name, `expects ${WHAT}, got ${showRaw(raw)}`);
      x = percent ? n / 100 : n;
    }
    if (!Number.isFinite(x) || x <= 0) throw new InputError(name, `must be greater than zero, got ${showRaw(raw)}`);
    if (x > MAX_STRAIN) {
      throw new InputError(
        name,
        `${showRaw(raw)} is above ${MAX_STRAIN} (${MAX_STRAIN * 100} %); the model is linear viscoelastic, for small strains only`,
      );
    }
    return x;
  },
};
