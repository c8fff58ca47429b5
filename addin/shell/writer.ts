/**
 * Safe writing: a block goes only into empty cells, in one batch, and a failure part-way takes back
 * everything this write did. Undo removes exactly what was written, and asks first if the user has
 * changed any of those cells since.
 */
import { boxAddress, boxOf, qualified, type Box, type Cell } from '../sheet/a1.js';
import { filledCells, type CellValue, type CellWrite, type ChartSpec, type SheetPort, type WriteReceipt } from '../sheet/port.js';

/** A block the pane wants to write; its formulas depend on where it lands. */
export interface Plan {
  /** Short name of what is written, for messages ("review", "PC parameters"). */
  readonly label: string;
  /** Base name for a new sheet when the target is occupied. */
  readonly sheetBase: string;
  readonly rows: number;
  readonly cols: number;
  build(sheet: string, topLeft: Cell): { cells: CellWrite[][]; chart: ChartSpec | null };
}

export interface WriteRecord {
  readonly label: string;
  readonly receipt: WriteReceipt;
  readonly chart: { sheet: string; name: string } | null;
  /** A sheet this write added, removed again by undo when nothing else is on it. */
  readonly createdSheet: string | null;
  /** Formula or constant of every written cell, to notice later edits. */
  readonly written: CellValue[][];
}

export type TargetCheck =
  | { readonly status: 'empty'; readonly sheet: string; readonly box: Box }
  | { readonly status: 'occupied'; readonly sheet: string; readonly box: Box; readonly filled: readonly Cell[] };

/** Thrown when a write finds its target occupied at the moment of writing. */
export class OccupiedError extends Error {
  override readonly name = 'OccupiedError';
  constructor(readonly where: string) {
    super(`${where} is not empty any more; nothing was written`);
  }
}

export async function checkTarget(port: SheetPort, sheet: string, topLeft: Cell, plan: Plan): Promise<TargetCheck> {
  const box = boxOf(topLeft, plan.rows, plan.cols);
  const content = await port.read({ sheet, box });
  const filled = filledCells(content).map((c) => ({ row: c.row + box.top, col: c.col + box.left }));
  return filled.length === 0 ? { status: 'empty', sheet, box } : { status: 'occupied', sheet, box, filled };
}

/** A sheet name not yet in the workbook: "Review 1", "Review 2", ... */
export async function freeSheetName(port: SheetPort, base: string): Promise<string> {
  const names = new Set((await port.sheetNames()).map((n) => n.toLowerCase()));
  for (let i = 1; ; i++) {
    const name = `${base} ${i}`;
    if (!names.has(name.toLowerCase())) return name;
  }
}

/**
 * Writes the plan at topLeft of sheet, or on a new sheet at A1 when newSheet is given. Checks again
 * that the target is empty; on any failure, undoes its own steps in reverse and rethrows.
 */
export async function commit(
  port: SheetPort,
  plan: Plan,
  target: { sheet: string; topLeft: Cell } | { newSheet: string },
): Promise<WriteRecord> {
  let createdSheet: string | null = null;
  let receipt: WriteReceipt | null = null;
  let chart: { sheet: string; name: string } | null = null;
  try {
    let sheet: string;
    let topLeft: Cell;
    if ('newSheet' in target) {
      await port.addSheet(target.newSheet);
      createdSheet = target.newSheet;
      sheet = target.newSheet;
      topLeft = { row: 0, col: 0 };
    } else {
      ({ sheet, topLeft } = target);
    }
    const check = await checkTarget(port, sheet, topLeft, plan);
    if (check.status === 'occupied') throw new OccupiedError(qualified(sheet, check.box, false));
    const built = plan.build(sheet, topLeft);
    receipt = await port.write(sheet, topLeft, built.cells);
    if (built.chart) {
      await port.addChart(built.chart);
      chart = { sheet: built.chart.sheet, name: built.chart.name };
    }
    const written = built.cells.map((row) => Array.from({ length: plan.cols }, (_, c) => row[c]?.formula ?? row[c]?.value ?? ''));
    return { label: plan.label, receipt, chart, createdSheet, written };
  } catch (err) {
    const problems: string[] = [];
    const attempt = async (what: string, step: () => Promise<void>): Promise<void> => {
      try {
        await step();
      } catch (e) {
        problems.push(`${what}: ${e instanceof Error ? e.message : String(e)}`);
      }
    };
    if (chart) {
      const c = chart;
      await attempt('removing the chart', () => port.removeChart(c.sheet, c.name));
    }
    if (receipt) {
      const r = receipt;
      await attempt('clearing the cells', () => port.clear(r));
    }
    if (createdSheet) {
      const s = createdSheet;
      await attempt('removing the new sheet', () => port.removeSheet(s));
    }
    if (problems.length > 0) {
      const base = err instanceof Error ? err.message : String(err);
      throw new Error(`${base}. Taking the write back also failed (${problems.join('; ')}); check the sheet by hand.`, { cause: err });
    }
    throw err;
  }
}

export type UndoResult = { readonly status: 'done' } | { readonly status: 'changed'; readonly cells: number; readonly where: string };

/** Removes what the record wrote. Without force, stops and reports when the user has edited those cells since. */
export async function undo(port: SheetPort, record: WriteRecord, force = false): Promise<UndoResult> {
  const { sheet, box } = record.receipt;
  if (!(await port.sheetNames()).includes(sheet)) return { status: 'done' };
  const now = await port.read({ sheet, box });
  let changed = 0;
  record.written.forEach((row, r) =>
    row.forEach((w, c) => {
      if (!sameCell(now.formulas[r]?.[c], w)) changed++;
    }),
  );
  if (changed > 0 && !force) return { status: 'changed', cells: changed, where: qualified(sheet, box, false) };
  if (record.chart) {
    try {
      await port.removeChart(record.chart.sheet, record.chart.name);
    } catch (e) {
      // The user may have deleted the chart already; anything else is a real failure.
      if (!(e instanceof Error && /no chart|not found|ItemNotFound/i.test(e.message))) throw e;
    }
  }
  await port.clear(record.receipt);
  if (record.createdSheet && !(await port.sheetInUse(record.createdSheet))) await port.removeSheet(record.createdSheet);
  return { status: 'done' };
}

function sameCell(now: CellValue | undefined, written: CellValue): boolean {
  if (now === undefined) return written === '';
  if (typeof now === 'string' && typeof written === 'string') {
    // Excel may re-space or re-case a formula it hands back.
    return written.startsWith('=') ? now.replace(/\s+/g, '').toUpperCase() === written.replace(/\s+/g, '').toUpperCase() : now === written;
  }
  return now === written;
}

export function describeBox(sheet: string, box: Box): string {
  return `${sheet}!${boxAddress(box)}`;
}
