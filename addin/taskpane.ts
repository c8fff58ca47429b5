/// <reference types="office-js" />
/**
 * The task pane: three jobs (look up a family, build a review, calibrate a grade) over the sheet port. Inside Excel the
 * Office adapter is used; anywhere else (the preview, the browser tests) the in-memory sheet is drawn
 * beside the pane.
 */
import type { CalibrationResult } from '../src/calibrate.js';
import { InputError, ParameterError, UnknownFamilyError } from '../src/errors.js';
import { FAMILIES, getFamily } from '../src/families.js';
import { parseRef, qualified, type Box, type Cell } from './a1.js';
import {
  CALIBRATION_FIELD_NAMES,
  QUALITY_TEXT,
  readCalibration,
  type CalibrationFields,
  type CalibrationRequest,
} from './calibrate-form.js';
import { byId, h } from './dom.js';
import { familyBlockPlan, searchFamilies, summarize } from './families-job.js';
import { MemoryWorkbook } from './memory-sheet.js';
import { MemoryView } from './memory-view.js';
import { CALIBRATION_NOTE, CAUTION } from './notes.js';
import { OfficeSheet } from './office-sheet.js';
import { formatModulus, type SheetPort, type SheetRange } from './port.js';
import {
  checkCycle,
  paramsFromBlock,
  parseRequired,
  parseServiceTime,
  parseTemperatureList,
  reviewPlan,
  reviewResults,
  type Candidate,
  type CycleStep,
  type Load,
  type ReviewInput,
} from './review.js';
import { checkTarget, commit, freeSheetName, undo, type Plan, type WriteRecord } from './writer.js';

type CandidateEntry = { kind: 'family'; id: string } | { kind: 'block'; ref: string };

interface State {
  port: SheetPort;
  view: MemoryView | null;
  candidates: CandidateEntry[];
  steps: CycleStep[];
  history: WriteRecord[];
  /** Target fields (by element id) that follow the selection until the user types in them. */
  follow: Record<string, boolean>;
  /** The calibration shown in the pane, until its inputs change. */
  calibration: { request: CalibrationRequest; result: CalibrationResult } | null;
}

declare global {
  interface Window {
    /** Set whenever the in-page sheet is used (the preview, or the add-in page opened outside Excel), for the browser tests. */
    resinDeratePreview?: { workbook: MemoryWorkbook; view: MemoryView };
  }
}

let state: State;

// ---------- start-up ----------

/**
 * The add-in page (taskpane.html) always loads Office.js in its head, wherever it is opened; Office.onReady says
 * whether Excel opened it (outside Office it resolves with host null). The preview page (preview.html, marked
 * data-page="preview") has no Office.js and uses the in-page sheet at once.
 */
async function pickPort(): Promise<{ port: SheetPort; note: string }> {
  if (document.documentElement.dataset.page === 'preview') {
    return { port: new MemoryWorkbook(), note: 'Preview: an in-page sheet stands in for Excel' };
  }
  if (typeof Office === 'undefined') return { port: new MemoryWorkbook(), note: 'Office.js did not load: using the in-page sheet' };
  const info = await Office.onReady();
  if (info.host === Office.HostType.Excel) return { port: new OfficeSheet(), note: 'Connected to Excel' };
  if (info.host === null) return { port: new MemoryWorkbook(), note: 'Not opened by Excel: using the in-page sheet' };
  return { port: new MemoryWorkbook(), note: `This host (${String(info.host)}) is not Excel: using the in-page sheet` };
}

async function start(): Promise<void> {
  const { port, note } = await pickPort();
  let view: MemoryView | null = null;
  if (port instanceof MemoryWorkbook) {
    view = new MemoryView(port);
    view.mount();
    window.resinDeratePreview = { workbook: port, view };
  }
  state = {
    port,
    view,
    candidates: [
      { kind: 'family', id: 'PC' },
      { kind: 'family', id: 'PBT' },
      { kind: 'family', id: 'POM' },
    ],
    // Invented example cycle: 8 h a day at 70 degC, 16 h at 30 degC, ten years.
    steps: [
      { temperatureC: 70, hours: 8 },
      { temperatureC: 30, hours: 16 },
    ],
    history: [],
    follow: { target: true, 'cal-target': true },
    calibration: null,
  };
  byId('host-note').textContent = note;
  byId('caution-text').textContent = CAUTION;
  setUpTabs();
  setUpFamilies();
  setUpReview();
  setUpCalibrate();
  byId('undo').addEventListener('click', () => void undoLast());
  try {
    await port.watchSelection(() => void refreshTarget());
  } catch {
    // Hosts without selection events: the "Selected cell" button still reads the selection.
  }
  await refreshTarget();
  document.body.dataset.ready = 'true';
}

// ---------- tabs ----------

function setUpTabs(): void {
  const tabs = Array.from(document.querySelectorAll<HTMLButtonElement>('[role=tab]'));
  const show = (tab: HTMLButtonElement, focus: boolean): void => {
    for (const t of tabs) {
      const on = t === tab;
      t.setAttribute('aria-selected', on ? 'true' : 'false');
      t.tabIndex = on ? 0 : -1;
      byId(t.getAttribute('aria-controls') ?? '').hidden = !on;
    }
    if (focus) tab.focus();
    if (tab.id === 'tab-review' || tab.id === 'tab-calibrate') void refreshTarget();
  };
  tabs.forEach((t, i) => {
    t.addEventListener('click', () => show(t, false));
    t.addEventListener('keydown', (e) => {
      const next =
        e.key === 'ArrowRight' ? i + 1 : e.key === 'ArrowLeft' ? i - 1 : e.key === 'Home' ? 0 : e.key === 'End' ? tabs.length - 1 : null;
      if (next === null) return;
      e.preventDefault();
      const tab = tabs[(next + tabs.length) % tabs.length];
      if (tab) show(tab, true);
    });
  });
}

// ---------- messages, asking, undo ----------

function say(text: string, kind: 'ok' | 'error' | 'info' = 'info', extra?: HTMLElement): void {
  const box = byId('status');
  box.className = `status ${kind}`;
  box.setAttribute('role', kind === 'error' ? 'alert' : 'status');
  box.replaceChildren(h('p', {}, text), ...(extra ? [extra] : []));
  box.scrollIntoView({ block: 'nearest' });
}

function describeError(e: unknown): string {
  if (e instanceof InputError) return `${capital(e.argument)}: ${e.problem}`;
  if (e instanceof ParameterError || e instanceof UnknownFamilyError) return capital(e.message);
  return e instanceof Error ? e.message : String(e);
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** Shows a question in the pane (Office add-ins cannot use window.confirm) and resolves with the choice. */
function ask(title: string, text: string, choices: { id: string; label: string; primary?: boolean }[]): Promise<string> {
  const dialog = byId('ask');
  const before = document.activeElement instanceof HTMLElement ? document.activeElement : null;
  byId('ask-title').textContent = title;
  byId('ask-text').textContent = text;
  return new Promise((resolve) => {
    const finish = (id: string): void => {
      dialog.hidden = true;
      buttons.replaceChildren();
      before?.focus();
      resolve(id);
    };
    const buttons = byId('ask-buttons');
    buttons.replaceChildren(
      ...choices.map((c) =>
        h(
          'button',
          { type: 'button', id: `ask-${c.id}`, class: c.primary ? 'primary' : 'secondary', onclick: () => finish(c.id) },
          c.label,
        ),
      ),
    );
    dialog.onkeydown = (e: KeyboardEvent) => {
      if (e.key === 'Escape') finish('cancel');
    };
    dialog.hidden = false;
    buttons.querySelector('button')?.focus();
  });
}

/** Checks the target, asks when it holds anything, writes, and records the write for undo. */
async function safeWrite(plan: Plan, sheet: string, topLeft: Cell): Promise<WriteRecord | null> {
  const check = await checkTarget(state.port, sheet, topLeft, plan);
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
    target = { newSheet: await freeSheetName(state.port, plan.sheetBase) };
  }
  try {
    const record = await commit(state.port, plan, target);
    state.history.push(record);
    updateUndo();
    return record;
  } catch (e) {
    say(`Nothing was written: ${describeError(e)}`, 'error');
    return null;
  }
}

function updateUndo(): void {
  const last = state.history[state.history.length - 1];
  byId('last-write').hidden = !last;
  if (last)
    byId('last-write-text').textContent =
      `Last write: ${last.label} at ${qualified(last.receipt.sheet, last.receipt.box, false)}${last.createdSheet ? ' (new sheet)' : ''}.`;
}

async function undoLast(): Promise<void> {
  const last = state.history[state.history.length - 1];
  if (!last) return;
  try {
    let result = await undo(state.port, last);
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
      result = await undo(state.port, last, true);
    }
    state.history.pop();
    updateUndo();
    say(
      `Removed the ${last.label} from ${qualified(last.receipt.sheet, last.receipt.box, false)}${last.createdSheet ? ' and its sheet' : ''}.`,
      'ok',
    );
    await refreshTarget();
  } catch (e) {
    say(`Undo failed: ${describeError(e)}`, 'error');
  }
}

async function selectionTopLeft(): Promise<{ sheet: string; topLeft: Cell; range: SheetRange }> {
  const sel = await state.port.selection();
  return { sheet: sel.sheet, topLeft: { row: sel.box.top, col: sel.box.left }, range: sel };
}

// ---------- job 1: families ----------

function setUpFamilies(): void {
  const input = byId<HTMLInputElement>('family-search');
  input.addEventListener('input', () => renderFamilies(input.value));
  renderFamilies('');
}

function renderFamilies(query: string): void {
  const found = searchFamilies(query);
  byId('family-count').textContent =
    found.length === FAMILIES.length ? `${found.length} families` : `${found.length} of ${FAMILIES.length} families match`;
  byId('family-list').replaceChildren(
    ...found.map((f) => {
      const s = summarize(f);
      return h(
        'li',
        { class: 'card', 'data-family': s.id },
        h('div', { class: 'card-head' }, h('h3', { id: `fam-${s.id}` }, s.id), h('span', { class: `kind kind-${f.params.kind}` }, s.kind)),
        h('p', { class: 'card-name' }, s.name),
        s.note ? h('p', { class: 'card-note' }, s.note) : null,
        h('dl', { class: 'facts' }, ...s.quantities.flatMap((q) => [h('dt', {}, q.label), h('dd', {}, q.text)])),
        h(
          'details',
          { class: 'sources' },
          h('summary', {}, 'Where these numbers come from'),
          h('ul', {}, ...s.quantities.filter((q) => q.text !== '-').map((q) => h('li', {}, h('strong', {}, `${q.label}: `), q.source))),
        ),
        h(
          'button',
          { type: 'button', class: 'secondary', 'aria-describedby': `fam-${s.id}`, onclick: () => void writeFamily(s.id) },
          'Write parameters at the selected cell',
        ),
      );
    }),
  );
}

async function writeFamily(id: string): Promise<void> {
  try {
    const f = getFamily(id);
    const plan = familyBlockPlan(f);
    const { sheet, topLeft } = await selectionTopLeft();
    byId('status').replaceChildren();
    const record = await safeWrite(plan, sheet, topLeft);
    if (!record) return;
    const ref = qualified(record.receipt.sheet, record.receipt.box);
    say(
      `Wrote the ${f.params.id} parameters to ${qualified(record.receipt.sheet, record.receipt.box, false)}. Edit the values to describe your grade and pass the range as the material of any DERATE function, e.g. =DERATE.MODULUS(${ref}, 80, "1000 h").`,
      'ok',
      addToReviewButton(record.receipt.sheet, record.receipt.box),
    );
  } catch (e) {
    say(describeError(e), 'error');
  }
}

/** A button that adds a parameter block just written to the review's candidates. */
function addToReviewButton(sheet: string, box: Box): HTMLButtonElement {
  const where = qualified(sheet, box, false);
  const button = h(
    'button',
    {
      type: 'button',
      class: 'secondary',
      id: 'add-written-block',
      onclick: () => {
        if (state.candidates.some((c) => c.kind === 'block' && c.ref === where)) {
          say(`${where} is already a review candidate.`, 'info');
          return;
        }
        state.candidates.push({ kind: 'block', ref: where });
        renderCandidates();
        say(`Added ${where} to the review candidates.`, 'ok');
      },
    },
    'Add this block to the review',
  );
  return button;
}

// ---------- job 2: review ----------

function setUpReview(): void {
  const select = byId<HTMLSelectElement>('add-family');
  select.replaceChildren(...FAMILIES.map((f) => h('option', { value: f.params.id }, `${f.params.id} - ${f.params.name}`)));
  byId('add-family-btn').addEventListener('click', () => {
    if (state.candidates.some((c) => c.kind === 'family' && c.id === select.value)) {
      say(`${select.value} is already a candidate.`, 'info');
      return;
    }
    state.candidates.push({ kind: 'family', id: select.value });
    renderCandidates();
  });
  const blockInput = byId<HTMLInputElement>('add-block');
  byId('block-from-selection').addEventListener('click', () => {
    void state.port.selection().then((sel) => {
      blockInput.value = qualified(sel.sheet, sel.box, false);
    });
  });
  byId('add-block-btn').addEventListener('click', () => void addBlock(blockInput.value));
  blockInput.addEventListener('keydown', (e) => {
    if (e.key === 'Enter') {
      e.preventDefault();
      void addBlock(blockInput.value);
    }
  });
  for (const r of Array.from(document.querySelectorAll<HTMLInputElement>('input[name=load]'))) r.addEventListener('change', showLoad);
  byId('add-step').addEventListener('click', () => {
    state.steps.push({ temperatureC: 23, hours: 1 });
    renderSteps();
    document.querySelector<HTMLInputElement>(`#step-${state.steps.length - 1}-temp`)?.focus();
  });
  followSelection('target', 'target-from-selection');
  byId<HTMLFormElement>('review-form').addEventListener('submit', (e) => {
    e.preventDefault();
    void writeReview();
  });
  renderCandidates();
  renderSteps();
  showLoad();
}

/** A target field shows the selected cell until the user types in it; its button makes it follow again. */
function followSelection(field: string, button: string): void {
  byId<HTMLInputElement>(field).addEventListener('input', () => {
    state.follow[field] = false;
  });
  byId(button).addEventListener('click', () => {
    state.follow[field] = true;
    void refreshTarget();
  });
}

async function refreshTarget(): Promise<void> {
  const fields = Object.keys(state.follow).filter((id) => state.follow[id]);
  if (fields.length === 0) return;
  try {
    const sel = await state.port.selection();
    const text = qualified(sel.sheet, { ...sel.box, bottom: sel.box.top, right: sel.box.left }, false);
    for (const id of fields) byId<HTMLInputElement>(id).value = text;
  } catch {
    // Excel refuses a selection read while a cell is being edited; the field keeps its last value.
  }
}

async function addBlock(text: string): Promise<void> {
  try {
    const range = await resolveRange(text, 'parameter block');
    const where = qualified(range.sheet, range.box, false);
    paramsFromBlock(await state.port.read(range), where);
    state.candidates.push({ kind: 'block', ref: where });
    renderCandidates();
    byId<HTMLInputElement>('add-block').value = '';
    say(`Added the parameter block ${where}.`, 'ok');
  } catch (e) {
    say(describeError(e), 'error');
  }
}

async function resolveRange(text: string, argument: string): Promise<SheetRange> {
  if (text.trim() === '') throw new InputError(argument, 'give a range such as Sheet1!D2:E30, or select it and press the selection button');
  let ref;
  try {
    ref = parseRef(text);
  } catch (e) {
    throw new InputError(argument, e instanceof Error ? e.message : String(e));
  }
  const sheet = ref.sheet ?? (await state.port.selection()).sheet;
  if (!(await state.port.sheetNames()).includes(sheet)) throw new InputError(argument, `there is no sheet named '${sheet}'`);
  return { sheet, box: ref.box };
}

function renderCandidates(): void {
  const list = byId('candidate-list');
  if (state.candidates.length === 0) {
    list.replaceChildren(h('li', { class: 'empty' }, 'No candidates yet: add a family or a parameter block below.'));
    return;
  }
  list.replaceChildren(
    ...state.candidates.map((c, i) => {
      const label = c.kind === 'family' ? `${c.id} (family)` : `${c.ref} (parameter block)`;
      return h(
        'li',
        { 'data-candidate': c.kind === 'family' ? c.id : c.ref },
        h('span', {}, label),
        h(
          'button',
          {
            type: 'button',
            class: 'icon',
            'aria-label': `Remove ${label}`,
            onclick: () => {
              state.candidates.splice(i, 1);
              renderCandidates();
              byId('add-family').focus();
            },
          },
          'Remove',
        ),
      );
    }),
  );
}

function renderSteps(): void {
  byId('step-rows').replaceChildren(
    ...state.steps.map((s, i) =>
      h(
        'tr',
        {},
        h('th', { scope: 'row' }, String(i + 1)),
        h(
          'td',
          {},
          h('input', {
            id: `step-${i}-temp`,
            inputmode: 'decimal',
            value: String(s.temperatureC),
            'aria-label': `Step ${i + 1} temperature, degC`,
            onchange: (e: Event) =>
              (state.steps[i] = { ...s, ...state.steps[i], temperatureC: Number((e.target as HTMLInputElement).value) }),
          }),
        ),
        h(
          'td',
          {},
          h('input', {
            id: `step-${i}-hours`,
            inputmode: 'decimal',
            value: String(s.hours),
            'aria-label': `Step ${i + 1} hours per cycle`,
            onchange: (e: Event) => (state.steps[i] = { ...s, ...state.steps[i], hours: Number((e.target as HTMLInputElement).value) }),
          }),
        ),
        h(
          'td',
          {},
          h(
            'button',
            {
              type: 'button',
              class: 'icon',
              'aria-label': `Remove step ${i + 1}`,
              onclick: () => {
                state.steps.splice(i, 1);
                renderSteps();
                byId('add-step').focus();
              },
            },
            'Remove',
          ),
        ),
      ),
    ),
  );
}

function showLoad(): void {
  const cycle = byId<HTMLInputElement>('load-cycle-radio').checked;
  byId('load-time').hidden = cycle;
  byId('load-cycle').hidden = !cycle;
}

const FIELD_FOR: Record<string, string> = {
  'service temperatures': 'temps',
  'service time': 'duration',
  'required modulus': 'required',
  cycles: 'cycles',
  'duty cycle': 'add-step',
  candidates: 'add-family',
  target: 'target',
  'block target': 'cal-target',
};

function markInvalid(e: unknown): void {
  for (const el of Array.from(document.querySelectorAll('[aria-invalid=true]'))) el.removeAttribute('aria-invalid');
  if (!(e instanceof InputError)) return;
  const step = /^duty cycle step (\d+) (temperature|hours)$/.exec(e.argument);
  const id = step ? `step-${Number(step[1]) - 1}-${step[2] === 'temperature' ? 'temp' : 'hours'}` : FIELD_FOR[e.argument];
  const el = id ? document.getElementById(id) : null;
  if (el instanceof HTMLInputElement) el.setAttribute('aria-invalid', 'true');
}

async function readReviewInput(): Promise<ReviewInput> {
  const temperaturesC = parseTemperatureList(byId<HTMLInputElement>('temps').value);
  const requiredMPa = parseRequired(byId<HTMLInputElement>('required').value);
  let load: Load;
  if (byId<HTMLInputElement>('load-cycle-radio').checked) {
    const cyclesText = byId<HTMLInputElement>('cycles').value.trim();
    const cycles = Number(cyclesText);
    if (cyclesText === '' || !Number.isFinite(cycles)) throw new InputError('cycles', `must be a number, got '${cyclesText}'`);
    checkCycle(state.steps, cycles);
    load = { kind: 'cycle', steps: [...state.steps], cycles };
  } else {
    load = { kind: 'time', time: parseServiceTime(byId<HTMLInputElement>('duration').value) };
  }
  if (state.candidates.length === 0) throw new InputError('candidates', 'add at least one family or parameter block');
  const candidates: Candidate[] = [];
  for (const c of state.candidates) {
    if (c.kind === 'family') candidates.push({ kind: 'family', id: c.id });
    else {
      const range = await resolveRange(c.ref, `candidate ${c.ref}`);
      candidates.push({ kind: 'block', range, params: paramsFromBlock(await state.port.read(range), c.ref) });
    }
  }
  return { candidates, temperaturesC, load, requiredMPa };
}

async function writeReview(): Promise<void> {
  const button = byId<HTMLButtonElement>('write-review');
  button.disabled = true;
  try {
    const input = await readReviewInput();
    const plan = reviewPlan(input);
    const target = await resolveRange(byId<HTMLInputElement>('target').value, 'target');
    markInvalid(null);
    byId('status').replaceChildren();
    const record = await safeWrite(plan, target.sheet, { row: target.box.top, col: target.box.left });
    if (!record) return;
    renderSummary(input);
    say(
      `Wrote the review to ${qualified(record.receipt.sheet, record.receipt.box, false)}${record.createdSheet ? ` on the new sheet ${record.createdSheet}` : ''}, with a chart beside it. The formulas are live: change an input cell and they recalculate.`,
      'ok',
    );
  } catch (e) {
    markInvalid(e);
    say(describeError(e), 'error');
  } finally {
    button.disabled = false;
  }
}

function renderSummary(input: ReviewInput): void {
  const results = reviewResults(input);
  byId('review-summary').replaceChildren(
    h('h3', {}, `Lowest E_r against ${formatModulus(input.requiredMPa)} MPa required`),
    h(
      'table',
      { class: 'summary' },
      h(
        'thead',
        {},
        h('tr', {}, h('th', { scope: 'col' }, 'Material'), h('th', { scope: 'col' }, 'Lowest, MPa'), h('th', { scope: 'col' }, 'Verdict')),
      ),
      h(
        'tbody',
        {},
        ...results.map((r) =>
          h(
            'tr',
            {},
            h('th', { scope: 'row' }, r.label),
            h('td', { class: 'num' }, formatModulus(r.lowestMPa)),
            h('td', { class: r.pass ? 'pass' : 'fail' }, r.pass ? 'pass' : 'fail'),
          ),
        ),
      ),
    ),
  );
}

// ---------- job 3: calibrate a grade ----------

/** The element of each calibration field. */
const CAL_INPUT: Record<keyof CalibrationFields, string> = {
  start: 'cal-start',
  modulus23: 'cal-e23',
  hdtA: 'cal-hdta',
  hdtB: 'cal-hdtb',
  tg: 'cal-tg',
  tm: 'cal-tm',
  creepModulus: 'cal-creep',
  creepTime: 'cal-creep-time',
  creepTemperature: 'cal-creep-temp',
  id: 'cal-id',
};

for (const [key, id] of Object.entries(CAL_INPUT)) FIELD_FOR[CALIBRATION_FIELD_NAMES[key as keyof CalibrationFields]] = id;
FIELD_FOR['datasheet numbers'] = 'cal-e23';

function setUpCalibrate(): void {
  const select = byId<HTMLSelectElement>('cal-start');
  select.replaceChildren(...FAMILIES.map((f) => h('option', { value: f.params.id }, `${f.params.id} - ${f.params.name}`)));
  select.value = 'PBT';
  select.addEventListener('change', showStart);
  showStart();
  const form = byId<HTMLFormElement>('cal-form');
  // A result shown belongs to the numbers it came from: any edit takes it away until Calibrate is pressed again.
  form.addEventListener('input', dropCalibration);
  form.addEventListener('change', dropCalibration);
  form.addEventListener('submit', (e) => {
    e.preventDefault();
    void calibrate();
  });
  followSelection('cal-target', 'cal-target-from-selection');
  byId('cal-write').addEventListener('click', () => void writeCalibration());
  byId('cal-caution').textContent = CALIBRATION_NOTE;
}

function showStart(): void {
  const f = getFamily(byId<HTMLSelectElement>('cal-start').value);
  const s = summarize(f);
  const facts = s.quantities
    .filter((q) => q.text !== '-')
    .map((q) => `${q.label} ${q.text.replace(/ \(.*\)$/, '')}`)
    .join(', ');
  byId('cal-start-hint').textContent = `${s.kind}; the family has ${facts}. What you do not give stays as the family has it.`;
  byId('cal-tm-hint').textContent =
    f.params.kind === 'semicrystalline'
      ? 'Tg and Tm by DSC (Tm: the melting peak).'
      : `Tg by DSC. ${f.params.id} is ${s.kind}: leave Tm empty.`;
}

function dropCalibration(): void {
  if (!state.calibration) return;
  state.calibration = null;
  byId('cal-result').hidden = true;
}

function calibrationFields(): CalibrationFields {
  const v = (id: string): string => byId<HTMLInputElement | HTMLSelectElement>(id).value;
  return {
    start: v(CAL_INPUT.start),
    modulus23: v(CAL_INPUT.modulus23),
    hdtA: v(CAL_INPUT.hdtA),
    hdtB: v(CAL_INPUT.hdtB),
    tg: v(CAL_INPUT.tg),
    tm: v(CAL_INPUT.tm),
    creepModulus: v(CAL_INPUT.creepModulus),
    creepTime: v(CAL_INPUT.creepTime),
    creepTemperature: v(CAL_INPUT.creepTemperature),
    id: v(CAL_INPUT.id),
  };
}

/** A value for the check table: the number, then its unit (which may wrap onto the next line). */
function num(x: number | null, unit: string): (string | HTMLElement)[] {
  if (x === null) return ['not reached'];
  return [`${Number(x.toPrecision(4))} `, h('span', { class: 'unit' }, unit)];
}

type CalibrateJob = typeof import('./calibrate-job.js');
let calibrateJob: Promise<CalibrateJob> | null = null;

/** The calibration code (the engine's least-squares fit and the block layout), fetched on first use as its own chunk. */
function loadCalibrateJob(): Promise<CalibrateJob> {
  calibrateJob ??= import('./calibrate-job.js').catch((e: unknown) => {
    calibrateJob = null;
    throw e;
  });
  return calibrateJob;
}

async function calibrate(): Promise<void> {
  const button = byId<HTMLButtonElement>('calibrate');
  button.disabled = true;
  dropCalibration();
  try {
    const request = readCalibration(calibrationFields());
    markInvalid(null);
    say(`Calibrating ${request.start.params.id} to your datasheet numbers...`, 'info');
    // Let the message paint before the fit takes the main thread (well under a second).
    const [job] = await Promise.all([loadCalibrateJob(), new Promise((r) => setTimeout(r, 0))]);
    const result = job.runCalibration(request);
    state.calibration = { request, result };
    renderCalibration(result);
    byId('status').replaceChildren();
    byId('cal-result').hidden = false;
    await refreshTarget();
    byId('cal-result-title').scrollIntoView({ block: 'nearest' });
  } catch (e) {
    markInvalid(e);
    say(describeError(e), 'error');
  } finally {
    button.disabled = false;
  }
}

function renderCalibration(r: CalibrationResult): void {
  const quality = byId('cal-quality');
  quality.className = `quality quality-${r.quality}`;
  quality.textContent = `Quality ${r.quality}: ${QUALITY_TEXT[r.quality]}.`;
  byId('cal-check-rows').replaceChildren(
    ...r.residuals.map((x) =>
      h(
        'tr',
        {},
        h('th', { scope: 'row' }, x.input, h('span', { class: 'tolerance' }, `\u00b1\u00a0${x.tolerance.replace(' ', '\u00a0')}`)),
        h('td', { class: 'num' }, ...num(x.given, x.unit)),
        h('td', { class: 'num' }, ...num(x.reproduced, x.unit)),
        h('td', { class: x.within ? 'pass' : 'fail' }, x.within ? 'yes' : 'no'),
      ),
    ),
  );
  byId('cal-fitted').replaceChildren(
    ...(r.free.length === 0
      ? []
      : [
          h('h4', {}, 'Parameters fitted'),
          h(
            'ul',
            { class: 'notes' },
            ...r.free.map((f) =>
              h(
                'li',
                {},
                `${f.field}: ${Number(f.start.toPrecision(4))} to ${Number(f.value.toPrecision(4))}${f.atBound ? ' (on its search bound)' : ''}`,
              ),
            ),
          ),
        ]),
  );
  byId('cal-notes').replaceChildren(...r.notes.map((n) => h('li', {}, capital(n))));
}

async function writeCalibration(): Promise<void> {
  const current = state.calibration;
  if (!current) {
    say('Press Calibrate first: the block is written from the calibration shown.', 'info');
    return;
  }
  const button = byId<HTMLButtonElement>('cal-write');
  button.disabled = true;
  try {
    const target = await resolveRange(byId<HTMLInputElement>('cal-target').value, 'block target');
    markInvalid(null);
    byId('status').replaceChildren();
    const job = await loadCalibrateJob();
    const plan = job.calibrationPlan(current.request, current.result);
    const record = await safeWrite(plan, target.sheet, { row: target.box.top, col: target.box.left });
    if (!record) return;
    const box = job.calibratedBlockBox(current.result, { row: record.receipt.box.top, col: record.receipt.box.left });
    const where = qualified(record.receipt.sheet, box, false);
    say(
      `Wrote the calibrated block ${current.result.params.id} to ${where}${record.createdSheet ? ` on the new sheet ${record.createdSheet}` : ''}, with the datasheet check and the cautions below it. Pass the block as the material of any DERATE function, e.g. =DERATE.MODULUS(${qualified(record.receipt.sheet, box)}, 80, "1000 h").`,
      'ok',
      addToReviewButton(record.receipt.sheet, box),
    );
  } catch (e) {
    markInvalid(e);
    say(describeError(e), 'error');
  } finally {
    button.disabled = false;
  }
}

void start().catch((e: unknown) => {
  document.body.dataset.ready = 'failed';
  say(`The pane could not start: ${describeError(e)}`, 'error');
});
