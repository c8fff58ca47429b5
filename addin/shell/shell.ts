/**
 * The pane's shell, shared by the three jobs: the sheet port, tabs, the safe write (ask before touching a
 * cell that holds anything) with its "last write" line and undo, target fields that follow the selection,
 * ranges typed by the user, and the form field an input error points at.
 */
import { InputError } from '../../src/base/errors.js';
import { parseRef, qualified, type Box, type Cell } from '../sheet/a1.js';
import { filledCells, type SheetPort, type SheetRange } from '../sheet/port.js';
import { ask } from './ask.js';
import { byId, h } from './dom.js';
import { describeError, say } from './messages.js';
import { setUpTabs } from './tabs.js';
import { checkTarget, commit, freeSheetName, undo, type Plan, type WriteRecord } from './writer.js';

/** The element id of the form field an input error's argument names; undefined when the argument is not a job's. */
export type FieldFinder = (argument: string) => string | undefined;

/** Rows that must be empty under a suggested target (the lookup's block is about 30 rows; longer blocks are checked again on write). */
const FREE_ROWS = 30;

/** What every job gets: the sheet and the shared pieces of the pane. */
export class Shell {
  private readonly history: WriteRecord[] = [];
  /** Target fields (by element id) that follow the selection until the user types in them. */
  private readonly follow: Record<string, boolean> = {};
  private readonly finders: FieldFinder[] = [];

  constructor(readonly port: SheetPort) {}

  /** Wires the tabs and the undo button. */
  mount(): void {
    // A tab whose panel holds a target field shows the selection as it is now.
    setUpTabs((_tab, panel) => {
      if (Object.keys(this.follow).some((id) => panel.contains(document.getElementById(id)))) void this.refreshTarget();
    });
    byId('undo').addEventListener('click', () => void this.undoLast());
  }

  /** Keeps the following target fields on the selection from now on, and fills them once. */
  async watchSelection(): Promise<void> {
    try {
      await this.port.watchSelection(() => void this.refreshTarget());
    } catch {
      // Hosts without selection events: the "Selected cell" button still reads the selection.
    }
    await this.refreshTarget();
  }

  // ---------- target fields and ranges ----------

  /** A target field shows the selected cell until the user types in it; its button makes it follow again. */
  followSelection(field: string, button: string): void {
    this.follow[field] = true;
    byId<HTMLInputElement>(field).addEventListener('input', () => {
      this.follow[field] = false;
    });
    byId(button).addEventListener('click', () => {
      this.follow[field] = true;
      void this.refreshTarget();
    });
  }

  /** Writes the selected cell's address into every target field that follows the selection. */
  async refreshTarget(): Promise<void> {
    const fields = Object.keys(this.follow).filter((id) => this.follow[id]);
    if (fields.length === 0) return;
    try {
      const sel = await this.port.selection();
      const at = (await this.freeBelowWrites(sel)) ?? { row: sel.box.top, col: sel.box.left };
      const text = qualified(sel.sheet, { top: at.row, left: at.col, bottom: at.row, right: at.col }, false);
      for (const id of fields) byId<HTMLInputElement>(id).value = text;
    } catch {
      // Excel refuses a selection read while a cell is being edited; the field keeps its last value.
    }
  }

  /**
   * When the selection's top-left cell lies in a block the pane wrote (as it does right after a write), the
   * first cell below that block, in its columns, with an empty area of FREE_ROWS rows under it; else null.
   */
  private async freeBelowWrites(sel: SheetRange): Promise<Cell | null> {
    const boxes = this.history.filter((r) => r.receipt.sheet === sel.sheet).map((r) => r.receipt.box);
    const inside = (c: Cell): Box | undefined =>
      boxes.find((b) => c.row >= b.top && c.row <= b.bottom && c.col >= b.left && c.col <= b.right);
    const hit = inside({ row: sel.box.top, col: sel.box.left });
    if (!hit) return null;
    // One blank row between blocks keeps them apart when read.
    let row = hit.bottom + 2;
    for (let tries = 0; tries < 20; tries++) {
      const written = inside({ row, col: hit.left });
      if (written) {
        row = written.bottom + 2;
        continue;
      }
      const box: Box = { top: row, left: hit.left, bottom: row + FREE_ROWS - 1, right: hit.right };
      const filled = filledCells(await this.port.read({ sheet: sel.sheet, box }));
      if (filled.length === 0) return { row, col: hit.left };
      row += Math.max(...filled.map((c) => c.row)) + 2;
    }
    return null;
  }

  /** The selection's sheet and its top-left cell (0-based row and column). */
  async selectionTopLeft(): Promise<{ sheet: string; topLeft: Cell; range: SheetRange }> {
    const sel = await this.port.selection();
    return { sheet: sel.sheet, topLeft: { row: sel.box.top, col: sel.box.left }, range: sel };
  }

  /** A range the user typed (the selection's sheet when none is named); errors name the argument. */
  async resolveRange(text: string, argument: string): Promise<SheetRange> {
    if (text.trim() === '')
      throw new InputError(argument, 'give a range such as Sheet1!D2:E30, or select it and press the selection button');
    let ref;
    try {
      ref = parseRef(text);
    } catch (e) {
      throw new InputError(argument, e instanceof Error ? e.message : String(e));
    }
    const sheet = ref.sheet ?? (await this.port.selection()).sheet;
    if (!(await this.port.sheetNames()).includes(sheet)) throw new InputError(argument, `there is no sheet named '${sheet}'`);
    return { sheet, box: ref.box };
  }

  // ---------- the field an error points at ----------

  /** Adds a job's map from input error arguments to its form fields. */
  fieldsFor(find: FieldFinder): void {
    this.finders.push(find);
  }

  /**
   * Clears every field message and aria-invalid mark, then marks the field an input error names (if a job
   * knows it) and puts the message beside it. Returns that field, or null.
   */
  markInvalid(e: unknown): HTMLElement | null {
    for (const el of Array.from(document.querySelectorAll('[aria-invalid=true]'))) el.removeAttribute('aria-invalid');
    for (const msg of Array.from(document.querySelectorAll<HTMLElement>('.field-error'))) {
      const field = document.querySelector(`[aria-describedby~="${msg.id}"]`);
      const rest = (field?.getAttribute('aria-describedby') ?? '').split(/\s+/).filter((x) => x && x !== msg.id);
      if (rest.length > 0) field?.setAttribute('aria-describedby', rest.join(' '));
      else field?.removeAttribute('aria-describedby');
      msg.remove();
    }
    if (!(e instanceof InputError)) return null;
    let id: string | undefined;
    for (const find of this.finders) {
      id = find(e.argument);
      if (id) break;
    }
    const el = id ? document.getElementById(id) : null;
    if (!el || !id) return null;
    if (el instanceof HTMLInputElement || el instanceof HTMLSelectElement) el.setAttribute('aria-invalid', 'true');
    // Under the field's row (the field and its button), so that at any width the message sits by the field.
    const msg = h('p', { id: `${id}-error`, class: 'field-error' }, describeError(e));
    const row = el.parentElement?.classList.contains('inline') ? el.parentElement : el;
    row.after(msg);
    el.setAttribute('aria-describedby', [`${id}-error`, el.getAttribute('aria-describedby') ?? ''].join(' ').trim());
    return el;
  }

  /** An error in the message line and, for an input error a job knows, beside its field, with a link from the one to the other. */
  reportError(e: unknown): void {
    const field = this.markInvalid(e);
    if (!field) {
      say(describeError(e), 'error');
      return;
    }
    const link = h(
      'a',
      {
        href: `#${field.id}`,
        class: 'field-link',
        onclick: (ev: Event) => {
          ev.preventDefault();
          field.focus();
          field.scrollIntoView({ block: 'center' });
        },
      },
      'Go to the field',
    );
    say(describeError(e), 'error', link);
    // The field and its message are what to look at; the message line above keeps the summary and the link.
    document.getElementById(`${field.id}-error`)?.scrollIntoView({ block: 'center' });
  }

  // ---------- safe write and undo ----------

  /** Checks the target, asks when it holds anything, writes, and records the write for undo. */
  async safeWrite(plan: Plan, sheet: string, topLeft: Cell): Promise<WriteRecord | null> {
    const check = await checkTarget(this.port, sheet, topLeft, plan);
    let target: { sheet: string; topLeft: Cell } | { newSheet: string } = { sheet, topLeft };
    if (check.status === 'occupied') {
      const where = qualified(sheet, check.box, false);
      const n = check.filled.length;
      const choice = await ask(
        'Those cells are not empty',
        `The ${plan.label} needs ${where} (${plan.rows} rows x ${plan.cols} columns) and ${n} cell${n === 1 ? '' : 's'} there already hold${n === 1 ? 's' : ''} something. Nothing has been changed. Write it on a new sheet instead, or cancel and pick another cell?`,
        [
          { id: 'new-sheet', label: 'Write on a new sheet', primary: true },
          { id: 'cancel', label: 'Cancel' },
        ],
      );
      if (choice !== 'new-sheet') {
        say(`Nothing was written: ${where} is in use. Pick an empty cell or use a new sheet.`, 'info');
        return null;
      }
      target = { newSheet: await freeSheetName(this.port, plan.sheetBase) };
    }
    try {
      const record = await commit(this.port, plan, target);
      this.history.push(record);
      this.updateUndo();
      // The next write's default target is the free area below this one, not the cells just filled.
      for (const id of Object.keys(this.follow)) this.follow[id] = true;
      await this.refreshTarget();
      return record;
    } catch (e) {
      say(`Nothing was written: ${describeError(e)}`, 'error');
      return null;
    }
  }

  private updateUndo(): void {
    const last = this.history[this.history.length - 1];
    byId('last-write').hidden = !last;
    if (last)
      byId('last-write-text').textContent =
        `Last write: ${last.label} at ${qualified(last.receipt.sheet, last.receipt.box, false)}${last.createdSheet ? ' (new sheet)' : ''}.`;
  }

  private async undoLast(): Promise<void> {
    const last = this.history[this.history.length - 1];
    if (!last) return;
    try {
      let result = await undo(this.port, last);
      if (result.status === 'changed') {
        const choice = await ask(
          'Cells changed since the pane wrote them',
          `${result.cells} cell${result.cells === 1 ? '' : 's'} in ${result.where} now differ from what the pane wrote. Removing the ${last.label} would remove those edits too.`,
          [
            { id: 'keep', label: 'Keep everything', primary: true },
            { id: 'remove', label: 'Remove anyway' },
          ],
        );
        if (choice !== 'remove') {
          say('Undo cancelled; the sheet is unchanged.', 'info');
          return;
        }
        result = await undo(this.port, last, true);
      }
      this.history.pop();
      this.updateUndo();
      say(
        `Removed the ${last.label} from ${qualified(last.receipt.sheet, last.receipt.box, false)}${last.createdSheet ? ' and its sheet' : ''}.`,
        'ok',
      );
      await this.refreshTarget();
    } catch (e) {
      say(`Undo failed: ${describeError(e)}`, 'error');
    }
  }
}
