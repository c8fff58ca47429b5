/** Safe writing through the in-memory sheet: nothing the user typed is overwritten or lost. */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../src/index.js';
import { blockRows, familyBlockPlan } from '../addin/jobs/lookup/plan.js';
import { MemoryWorkbook } from '../addin/sheet/memory-sheet.js';
import { reviewPlan, type ReviewInput } from '../addin/jobs/review/plan.js';
import { checkTarget, commit, freeSheetName, OccupiedError, undo } from '../addin/shell/writer.js';

const REVIEW: ReviewInput = {
  candidates: [
    { kind: 'family', id: 'PC' },
    { kind: 'family', id: 'PBT' },
    { kind: 'family', id: 'PA66-cond' },
  ],
  temperaturesC: [23, 60, 90],
  load: { kind: 'time', time: '1000 h' },
  requiredMPa: 800,
};

function snapshot(wb: MemoryWorkbook, sheet: string): string {
  const out: string[] = [];
  for (let r = 0; r < 60; r++)
    for (let c = 0; c < 20; c++) if (wb.cell(sheet, r, c)) out.push(`${r},${c}=${JSON.stringify(wb.cell(sheet, r, c))}`);
  return out.join('\n');
}

describe('checkTarget', () => {
  it('reports every filled cell of the target and nothing outside it', async () => {
    const wb = new MemoryWorkbook();
    wb.typeInto('Sheet1', { row: 2, col: 1 }, 'mine');
    wb.typeInto('Sheet1', { row: 140, col: 0 }, 'far away');
    const plan = reviewPlan(REVIEW);
    const check = await checkTarget(wb, 'Sheet1', { row: 0, col: 0 }, plan);
    expect(check.status).toBe('occupied');
    if (check.status === 'occupied') expect(check.filled).toEqual([{ row: 2, col: 1 }]);
    expect((await checkTarget(wb, 'Sheet1', { row: 0, col: 10 }, plan)).status).toBe('empty');
  });
});

describe('commit', () => {
  it('refuses an occupied target and leaves it as it was', async () => {
    const wb = new MemoryWorkbook();
    wb.typeInto('Sheet1', { row: 5, col: 2 }, '42');
    const before = snapshot(wb, 'Sheet1');
    await expect(commit(wb, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toBeInstanceOf(OccupiedError);
    expect(snapshot(wb, 'Sheet1')).toBe(before);
    expect(wb.charts('Sheet1')).toHaveLength(0);
  });

  it('writes on a new sheet when asked, leaving the occupied one alone', async () => {
    const wb = new MemoryWorkbook();
    wb.typeInto('Sheet1', { row: 0, col: 0 }, 'notes');
    const name = await freeSheetName(wb, 'Review');
    expect(name).toBe('Review 1');
    const rec = await commit(wb, reviewPlan(REVIEW), { newSheet: name });
    expect(rec.createdSheet).toBe('Review 1');
    expect(await wb.sheetNames()).toEqual(['Sheet1', 'Review 1']);
    expect(wb.cell('Sheet1', 0, 0)?.value).toBe('notes');
    expect(wb.charts('Review 1')).toHaveLength(1);
    expect(await freeSheetName(wb, 'Review')).toBe('Review 2');
  });

  for (const op of ['write', 'addChart'] as const) {
    it(`takes everything back when ${op} fails part-way`, async () => {
      const wb = new MemoryWorkbook();
      wb.typeInto('Sheet1', { row: 130, col: 0 }, 'keep');
      const before = snapshot(wb, 'Sheet1');
      wb.failWhen = (o) => o === op;
      await expect(commit(wb, reviewPlan(REVIEW), { newSheet: 'Review 1' })).rejects.toThrow(/refused/);
      await expect(commit(wb, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toThrow(/refused/);
      expect(await wb.sheetNames()).toEqual(['Sheet1']);
      expect(snapshot(wb, 'Sheet1')).toBe(before);
      expect(wb.charts('Sheet1')).toHaveLength(0);
    });
  }

  it('says so when taking a failed write back fails too', async () => {
    const wb = new MemoryWorkbook();
    wb.failWhen = (o) => o === 'addChart' || o === 'clear';
    await expect(commit(wb, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } })).rejects.toThrow(
      /Taking the write back also failed.*clearing the cells/,
    );
  });
});

describe('undo', () => {
  it('removes exactly the cells and chart it wrote', async () => {
    const wb = new MemoryWorkbook();
    wb.typeInto('Sheet1', { row: 0, col: 9 }, 'beside');
    wb.typeInto('Sheet1', { row: 130, col: 0 }, 'below');
    const before = snapshot(wb, 'Sheet1');
    const rec = await commit(wb, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } });
    expect(wb.filledCount('Sheet1')).toBeGreaterThan(2);
    expect(await undo(wb, rec)).toEqual({ status: 'done' });
    expect(snapshot(wb, 'Sheet1')).toBe(before);
    expect(wb.charts('Sheet1')).toHaveLength(0);
  });

  it('asks before removing cells the user edited since, and removes them only when forced', async () => {
    const wb = new MemoryWorkbook();
    const f = getFamily('PBT');
    const rec = await commit(wb, familyBlockPlan(f), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } });
    wb.typeInto('Sheet1', { row: 4, col: 1 }, '45');
    const first = await undo(wb, rec);
    expect(first).toEqual({ status: 'changed', cells: 1, where: `Sheet1!A1:D${blockRows(f).length}` });
    expect(wb.cell('Sheet1', 4, 1)?.value).toBe(45);
    expect(await undo(wb, rec, true)).toEqual({ status: 'done' });
    expect(wb.filledCount('Sheet1')).toBe(0);
  });

  it('removes a sheet it added only when nothing else is left on it', async () => {
    const wb = new MemoryWorkbook();
    const a = await commit(wb, reviewPlan(REVIEW), { newSheet: 'Review 1' });
    wb.typeInto('Review 1', { row: 150, col: 0 }, 'my note on the new sheet');
    await undo(wb, a);
    expect(await wb.sheetNames()).toEqual(['Sheet1', 'Review 1']);
    expect(wb.filledCount('Review 1')).toBe(1);
    const b = await commit(wb, reviewPlan(REVIEW), { newSheet: 'Review 2' });
    await undo(wb, b);
    expect(await wb.sheetNames()).toEqual(['Sheet1', 'Review 1']);
  });

  it('still clears the cells when the user already deleted the chart', async () => {
    const wb = new MemoryWorkbook();
    const rec = await commit(wb, reviewPlan(REVIEW), { sheet: 'Sheet1', topLeft: { row: 0, col: 0 } });
    await wb.removeChart('Sheet1', rec.chart?.name ?? '');
    expect(await undo(wb, rec)).toEqual({ status: 'done' });
    expect(wb.filledCount('Sheet1')).toBe(0);
  });
});
