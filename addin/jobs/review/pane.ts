/**
 * The "build a review" job in the pane: the candidates (families and parameter blocks on the sheet), the
 * service temperatures and load (a time, or a duty cycle of steps), the target cell, and after a write the
 * summary of lowest moduli and verdicts. What it writes is plan.ts.
 */
import { InputError } from '../../../src/base/errors.js';
import { modulusText, mpaValue } from '../../../src/base/display.js';
import { FAMILIES } from '../../../src/material/families.js';
import { NO_FILLER, type FillerCode } from '../../../src/material/filler.js';
import { getGrade } from '../../../src/material/grade.js';
import { VERDICT } from '../../../src/answers/verdict.js';
import { cyclesInput } from '../../../src/input/count.js';
import { readRequired } from '../../../src/input/quantity.js';
import { qualified, type Box } from '../../sheet/a1.js';
import { byId, h } from '../../shell/dom.js';
import { clearMessage, say } from '../../shell/messages.js';
import type { Shell } from '../../shell/shell.js';
import { composeGrade, fillerOptions, GRADE_ARGS, humidBases, massRange, takesHumidity } from './grade.js';
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
} from './plan.js';

/** A candidate as the pane lists it: a family id, or the address of a parameter block read when the review is written. */
type CandidateEntry = { kind: 'family'; id: string } | { kind: 'block'; ref: string };

/** The form field of each input error argument of this job. */
const FIELD_FOR: Record<string, string> = {
  'service temperatures': 'temps',
  'service time': 'duration',
  'required modulus': 'required',
  cycles: 'cycles',
  'duty cycle': 'add-step',
  [GRADE_ARGS.base]: 'add-family',
  [GRADE_ARGS.mass]: 'add-mass',
  [GRADE_ARGS.humidity]: 'add-rh',
  target: 'target',
  'parameter block': 'add-block',
};

/** The review job's handle for the other jobs. */
export interface ReviewJob {
  /** The button, shown after a write, that adds the parameter block at sheet!box to the candidates. */
  offerBlock(sheet: string, box: Box): HTMLButtonElement;
}

/** Wires the review form and draws its lists. */
export function setUpReview(shell: Shell): ReviewJob {
  const pane = new ReviewPane(shell);
  return { offerBlock: (sheet, box) => pane.offerBlock(sheet, box) };
}

class ReviewPane {
  private readonly candidates: CandidateEntry[] = [
    { kind: 'family', id: 'PC' },
    { kind: 'family', id: 'PBT' },
    { kind: 'family', id: 'POM' },
  ];
  // Invented example cycle: 8 h a day at 70 degC, 16 h at 30 degC, ten years.
  private readonly steps: CycleStep[] = [
    { temperatureC: 70, hours: 8 },
    { temperatureC: 30, hours: 16 },
  ];

  constructor(private readonly shell: Shell) {
    const select = byId<HTMLSelectElement>('add-family');
    select.replaceChildren(
      ...FAMILIES.map((f) => h('option', { value: f.params.id }, `${f.params.id} - ${f.params.name}`)),
      ...humidBases().map((b) => h('option', { value: b.value }, b.text)),
    );
    byId<HTMLSelectElement>('add-filler').replaceChildren(...fillerOptions().map((o) => h('option', { value: o.value }, o.text)));
    for (const id of ['add-family', 'add-filler']) byId(id).addEventListener('change', () => this.showGradeFields());
    for (const id of ['add-mass', 'add-rh']) byId(id).addEventListener('input', () => this.showGradeFields());
    byId('add-family-btn').addEventListener('click', () => this.addGrade());
    for (const id of ['add-mass', 'add-rh']) {
      byId(id).addEventListener('keydown', (e) => {
        if (e.key === 'Enter') {
          e.preventDefault();
          this.addGrade();
        }
      });
    }
    this.showGradeFields();
    const blockInput = byId<HTMLInputElement>('add-block');
    byId('block-from-selection').addEventListener('click', () => {
      void shell.port.selection().then((sel) => {
        blockInput.value = qualified(sel.sheet, sel.box, false);
      });
    });
    byId('add-block-btn').addEventListener('click', () => void this.addBlock(blockInput.value));
    blockInput.addEventListener('keydown', (e) => {
      if (e.key === 'Enter') {
        e.preventDefault();
        void this.addBlock(blockInput.value);
      }
    });
    for (const r of Array.from(document.querySelectorAll<HTMLInputElement>('input[name=load]'))) r.addEventListener('change', showLoad);
    byId('add-step').addEventListener('click', () => {
      this.steps.push({ temperatureC: 23, hours: 1 });
      this.renderSteps();
      document.querySelector<HTMLInputElement>(`#step-${this.steps.length - 1}-temp`)?.focus();
    });
    shell.followSelection('target', 'target-from-selection');
    shell.fieldsFor((argument) => {
      const step = /^duty cycle step (\d+) (temperature|hours)$/.exec(argument);
      return step ? `step-${Number(step[1]) - 1}-${step[2] === 'temperature' ? 'temp' : 'hours'}` : FIELD_FOR[argument];
    });
    byId<HTMLFormElement>('review-form').addEventListener('submit', (e) => {
      e.preventDefault();
      void this.writeReview();
    });
    this.renderCandidates();
    this.renderSteps();
    showLoad();
  }

  /** The builder's fields as typed. */
  private gradeFields(): { base: string; filler: string; mass: string; humidity: string } {
    return {
      base: byId<HTMLSelectElement>('add-family').value,
      filler: byId<HTMLSelectElement>('add-filler').value,
      mass: byId<HTMLInputElement>('add-mass').value,
      humidity: byId<HTMLInputElement>('add-rh').value,
    };
  }

  /** Shows the mass field only with a filler and the humidity field only for a polyamide base, and the text "Add" will add. */
  private showGradeFields(): void {
    const f = this.gradeFields();
    const filled = f.filler !== NO_FILLER;
    byId('add-mass-row').hidden = !filled;
    if (filled) {
      const [lo, hi] = massRange(f.filler as FillerCode);
      byId('add-mass-hint').textContent = `${lo} to ${hi} % for ${f.filler}.`;
    }
    byId('add-rh-row').hidden = !takesHumidity(f.base);
    let text: string;
    try {
      text = `Adds ${composeGrade(f)}`;
    } catch {
      // Half-typed: "Add" reports the problem under its field; this line only says what would be added.
      text = 'Adds: check the fields above';
    }
    byId('add-grade-text').textContent = text;
  }

  /** Composes the grade from the builder's fields, checks it through the input layer and adds it as a candidate. */
  private addGrade(): void {
    try {
      const id = composeGrade(this.gradeFields());
      this.shell.markInvalid(null);
      if (this.candidates.some((c) => c.kind === 'family' && c.id.toLowerCase() === id.toLowerCase())) {
        say(`${id} is already a candidate.`, 'info');
        return;
      }
      this.candidates.push({ kind: 'family', id });
      this.renderCandidates();
      say(`Added ${id} to the review candidates.`, 'ok');
    } catch (e) {
      this.shell.reportError(e);
    }
  }

  offerBlock(sheet: string, box: Box): HTMLButtonElement {
    const where = qualified(sheet, box, false);
    const button = h(
      'button',
      {
        type: 'button',
        class: 'secondary',
        id: 'add-written-block',
        onclick: () => {
          if (this.candidates.some((c) => c.kind === 'block' && c.ref === where)) {
            say(`${where} is already a review candidate.`, 'info');
            return;
          }
          this.candidates.push({ kind: 'block', ref: where });
          this.renderCandidates();
          say(`Added ${where} to the review candidates.`, 'ok');
        },
      },
      'Add this block to the review',
    );
    return button;
  }

  private async addBlock(text: string): Promise<void> {
    try {
      const range = await this.shell.resolveRange(text, 'parameter block');
      const where = qualified(range.sheet, range.box, false);
      paramsFromBlock(await this.shell.port.read(range), where);
      this.candidates.push({ kind: 'block', ref: where });
      this.renderCandidates();
      byId<HTMLInputElement>('add-block').value = '';
      say(`Added the parameter block ${where}.`, 'ok');
    } catch (e) {
      this.shell.reportError(e);
    }
  }

  private renderCandidates(): void {
    const list = byId('candidate-list');
    if (this.candidates.length === 0) {
      list.replaceChildren(h('li', { class: 'empty' }, 'No candidates yet: add a family or a parameter block below.'));
      return;
    }
    list.replaceChildren(
      ...this.candidates.map((c, i) => {
        const label =
          c.kind === 'family'
            ? `${c.id} (${getGrade(c.id).params.filler === NO_FILLER ? 'family' : 'filled grade'})`
            : `${c.ref} (parameter block)`;
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
                this.candidates.splice(i, 1);
                this.renderCandidates();
                byId('add-family').focus();
              },
            },
            'Remove',
          ),
        );
      }),
    );
  }

  private renderSteps(): void {
    const steps = this.steps;
    byId('step-rows').replaceChildren(
      ...steps.map((s, i) =>
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
              onchange: (e: Event) => (steps[i] = { ...s, ...steps[i], temperatureC: Number((e.target as HTMLInputElement).value) }),
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
              onchange: (e: Event) => (steps[i] = { ...s, ...steps[i], hours: Number((e.target as HTMLInputElement).value) }),
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
                  steps.splice(i, 1);
                  this.renderSteps();
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

  private async readReviewInput(): Promise<ReviewInput> {
    const temperaturesC = parseTemperatureList(byId<HTMLInputElement>('temps').value);
    const requiredMPa = parseRequired(byId<HTMLInputElement>('required').value);
    let load: Load;
    if (byId<HTMLInputElement>('load-cycle-radio').checked) {
      const cyclesText = byId<HTMLInputElement>('cycles').value.trim();
      // The same quantity as DUTY's and EQTIME's cycles argument and the CLI's --cycles (src/input/count.ts).
      const cycles = readRequired(cyclesInput, cyclesText, 'cycles');
      checkCycle(this.steps, cycles);
      load = { kind: 'cycle', steps: [...this.steps], cycles };
    } else {
      load = { kind: 'time', time: parseServiceTime(byId<HTMLInputElement>('duration').value) };
    }
    if (this.candidates.length === 0) throw new InputError('candidates', 'add at least one family or parameter block');
    const candidates: Candidate[] = [];
    for (const c of this.candidates) {
      if (c.kind === 'family') candidates.push({ kind: 'family', id: c.id });
      else {
        const range = await this.shell.resolveRange(c.ref, `candidate ${c.ref}`);
        candidates.push({ kind: 'block', range, params: paramsFromBlock(await this.shell.port.read(range), c.ref) });
      }
    }
    return { candidates, temperaturesC, load, requiredMPa };
  }

  private async writeReview(): Promise<void> {
    const button = byId<HTMLButtonElement>('write-review');
    button.disabled = true;
    try {
      const input = await this.readReviewInput();
      const plan = reviewPlan(input);
      const target = await this.shell.resolveRange(byId<HTMLInputElement>('target').value, 'target');
      this.shell.markInvalid(null);
      clearMessage();
      const record = await this.shell.safeWrite(plan, target.sheet, { row: target.box.top, col: target.box.left });
      if (!record) return;
      renderSummary(input);
      say(
        `Wrote the review to ${qualified(record.receipt.sheet, record.receipt.box, false)}${record.createdSheet ? ` on the new sheet ${record.createdSheet}` : ''}, with a chart beside it. The formulas are live: change an input cell and they recalculate.`,
        'ok',
      );
    } catch (e) {
      this.shell.reportError(e);
    } finally {
      button.disabled = false;
    }
  }
}

function showLoad(): void {
  const cycle = byId<HTMLInputElement>('load-cycle-radio').checked;
  byId('load-time').hidden = cycle;
  byId('load-cycle').hidden = !cycle;
}

function renderSummary(input: ReviewInput): void {
  const results = reviewResults(input);
  byId('review-summary').replaceChildren(
    h('h3', {}, `Lowest E_r against ${modulusText(input.requiredMPa)} required`),
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
            h('td', { class: 'num' }, mpaValue(r.lowestMPa)),
            h('td', { class: r.pass ? 'pass' : 'fail' }, r.pass ? VERDICT.pass : VERDICT.fail),
          ),
        ),
      ),
    ),
  );
}
