/**
 * The "calibrate a grade" job in the pane: the datasheet form (starting family and the numbers the user
 * has), the result (quality, datasheet check, parameters fitted, notes) and writing the calibrated block.
 * Reading the form is request.ts; the fit and the block (plan.ts) are fetched as their own chunk on first use.
 */
import { valueIn } from '../../../src/base/display.js';
import type { CalibrationResult } from '../../../src/fit/calibrate.js';
import { FAMILIES, getFamily } from '../../../src/material/families.js';
import { qualified } from '../../sheet/a1.js';
import { byId, h } from '../../shell/dom.js';
import { capital, clearMessage, say } from '../../shell/messages.js';
import type { Shell } from '../../shell/shell.js';
import { summarize } from '../lookup/plan.js';
import { CALIBRATION_NOTE } from '../notes.js';
import type { ReviewJob } from '../review/pane.js';
import {
  CALIBRATION_FIELD_NAMES,
  fittedText,
  QUALITY_TEXT,
  readCalibration,
  type CalibrationFields,
  type CalibrationRequest,
} from './request.js';

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

/** The form field of each input error argument of this job. */
const FIELD_FOR: Record<string, string> = { 'block target': 'cal-target' };
for (const [key, id] of Object.entries(CAL_INPUT)) FIELD_FOR[CALIBRATION_FIELD_NAMES[key as keyof CalibrationFields]] = id;
FIELD_FOR['datasheet numbers'] = 'cal-e23';

type CalibrateJob = typeof import('./plan.js');
let calibrateJob: Promise<CalibrateJob> | null = null;

/** The calibration code (the engine's least-squares fit and the block layout), fetched on first use as its own chunk. */
function loadCalibrateJob(): Promise<CalibrateJob> {
  calibrateJob ??= import('./plan.js').catch((e: unknown) => {
    calibrateJob = null;
    throw e;
  });
  return calibrateJob;
}

/** Wires the calibration form; a block written can be handed to the review. */
export function setUpCalibrate(shell: Shell, review: ReviewJob): void {
  new CalibratePane(shell, review);
}

class CalibratePane {
  /** The calibration shown in the pane, until its inputs change. */
  private calibration: { request: CalibrationRequest; result: CalibrationResult } | null = null;

  constructor(
    private readonly shell: Shell,
    private readonly review: ReviewJob,
  ) {
    const select = byId<HTMLSelectElement>('cal-start');
    select.replaceChildren(...FAMILIES.map((f) => h('option', { value: f.params.id }, `${f.params.id} - ${f.params.name}`)));
    select.value = 'PBT';
    select.addEventListener('change', showStart);
    showStart();
    const form = byId<HTMLFormElement>('cal-form');
    // A result shown belongs to the numbers it came from: any edit takes it away until Calibrate is pressed again.
    const drop = (): void => this.dropCalibration();
    form.addEventListener('input', drop);
    form.addEventListener('change', drop);
    form.addEventListener('submit', (e) => {
      e.preventDefault();
      void this.calibrate();
    });
    shell.followSelection('cal-target', 'cal-target-from-selection');
    shell.fieldsFor((argument) => FIELD_FOR[argument]);
    byId('cal-write').addEventListener('click', () => void this.writeCalibration());
    byId('cal-caution').textContent = CALIBRATION_NOTE;
  }

  private dropCalibration(): void {
    if (!this.calibration) return;
    this.calibration = null;
    byId('cal-result').hidden = true;
  }

  private async calibrate(): Promise<void> {
    const button = byId<HTMLButtonElement>('calibrate');
    button.disabled = true;
    this.dropCalibration();
    try {
      const request = readCalibration(calibrationFields());
      this.shell.markInvalid(null);
      say(`Calibrating ${request.start.params.id} to your datasheet numbers...`, 'info');
      // Let the message paint before the fit takes the main thread (well under a second).
      const [job] = await Promise.all([loadCalibrateJob(), new Promise((r) => setTimeout(r, 0))]);
      const result = job.runCalibration(request);
      this.calibration = { request, result };
      renderCalibration(result);
      clearMessage();
      byId('cal-result').hidden = false;
      await this.shell.refreshTarget();
      byId('cal-result-title').scrollIntoView({ block: 'nearest' });
    } catch (e) {
      this.shell.reportError(e);
    } finally {
      button.disabled = false;
    }
  }

  private async writeCalibration(): Promise<void> {
    const current = this.calibration;
    if (!current) {
      say('Press Calibrate first: the block is written from the calibration shown.', 'info');
      return;
    }
    const button = byId<HTMLButtonElement>('cal-write');
    button.disabled = true;
    try {
      const target = await this.shell.resolveRange(byId<HTMLInputElement>('cal-target').value, 'block target');
      this.shell.markInvalid(null);
      clearMessage();
      const job = await loadCalibrateJob();
      const plan = job.calibrationPlan(current.request, current.result);
      const record = await this.shell.safeWrite(plan, target.sheet, { row: target.box.top, col: target.box.left });
      if (!record) return;
      const box = job.calibratedBlockBox(current.result, { row: record.receipt.box.top, col: record.receipt.box.left });
      const where = qualified(record.receipt.sheet, box, false);
      say(
        `Wrote the calibrated block ${current.result.params.id} to ${where}${record.createdSheet ? ` on the new sheet ${record.createdSheet}` : ''}, with the datasheet check and the cautions below it. Pass the block as the material of any DERATE function, e.g. =DERATE.MODULUS(${qualified(record.receipt.sheet, box)}, 80, "1000 h").`,
        'ok',
        this.review.offerBlock(record.receipt.sheet, box),
      );
    } catch (e) {
      this.shell.reportError(e);
    } finally {
      button.disabled = false;
    }
  }
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
  return [`${valueIn(x, unit)} `, h('span', { class: 'unit' }, unit)];
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
          h('ul', { class: 'notes' }, ...r.free.map((f) => h('li', { 'data-field': f.field }, fittedText(f, r.family)))),
        ]),
  );
  byId('cal-notes').replaceChildren(...r.notes.map((n) => h('li', {}, capital(n))));
}
