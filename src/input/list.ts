/**
 * Lists of a quantity: comma-separated text (a CLI option, a pane field) or the cells of a one-row or
 * one-column range (the worksheet; its adapter hands the cells over). Each item goes to the quantity;
 * an error names the input and says which item.
 */
import { InputError } from '../base/errors.js';
import { UnknownFamilyInput } from './material.js';
import type { Quantity, Raw } from './quantity.js';

/** Runs `f` for item i of n; an error naming `name` says which item (cell or item i + 1) when there are several. */
export function atItem<T>(name: string, word: 'cell' | 'item', i: number, n: number, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (n > 1 && e instanceof InputError && e.argument === name) {
      const problem = `${word} ${i + 1}: ${e.problem}`;
      // An unknown family stays "not found".
      throw e instanceof UnknownFamilyInput ? new UnknownFamilyInput(name, problem, e.suggestions) : new InputError(name, problem);
    }
    throw e;
  }
}

/** Each raw value through the quantity, errors saying which cell or item. */
export function eachItem<T>(q: Quantity<T>, raws: readonly Raw[], name: string, word: 'cell' | 'item'): T[] {
  return raws.map((raw, i) => atItem(name, word, i, raws.length, () => q.parse(raw, name)));
}

/** The items of comma- or semicolon-separated text, trimmed, empty ones dropped; none is an error saying what to type. */
export function splitList(text: string, name: string, what: string): string[] {
  const items = text
    .split(/[,;]/)
    .map((s) => s.trim())
    .filter((s) => s !== '');
  if (items.length === 0) throw new InputError(name, `is empty; type ${what}, separated by commas`);
  return items;
}

/** A list of a quantity typed as text ("23, 60, 80 degC"). */
export function listInput<T>(q: Quantity<T>): Quantity<T[]> {
  return {
    what: `${q.what}, separated by commas`,
    unit: q.unit,
    ...(q.min !== undefined ? { min: q.min } : {}),
    ...(q.max !== undefined ? { max: q.max } : {}),
    parse(raw, name) {
      if (typeof raw === 'number') return [q.parse(raw, name)];
      return eachItem(q, splitList(raw, name, q.what), name, 'item');
    },
  };
}
