/** The "look up a family" job in the pane: the search box, a card per family, and writing its parameter block. */
import { familiesAndGrades, getGrade } from '../../../src/material/grade.js';
import { qualified } from '../../sheet/a1.js';
import { byId, h } from '../../shell/dom.js';
import { clearMessage, describeError, say } from '../../shell/messages.js';
import type { Shell } from '../../shell/shell.js';
import type { ReviewJob } from '../review/pane.js';
import { familyBlockPlan, searchFamilies, summarize } from './plan.js';

/** Wires the search box and draws every family; a block written can be handed to the review. */
export function setUpLookup(shell: Shell, review: ReviewJob): void {
  const input = byId<HTMLInputElement>('family-search');
  const render = (query: string): void => renderFamilies(query, (id) => void writeFamily(shell, review, id));
  input.addEventListener('input', () => render(input.value));
  render('');
}

function renderFamilies(query: string, write: (id: string) => void): void {
  const found = searchFamilies(query);
  const all = familiesAndGrades().length;
  byId('family-count').textContent =
    found.length === all ? `${found.length} families and filled grades` : `${found.length} of ${all} families and filled grades match`;
  byId('family-list').replaceChildren(
    ...found.map((f) => {
      const s = summarize(f);
      // A derived id ("PA66 at 70 % RH") has spaces, which an element id and aria-describedby cannot hold.
      const headId = `fam-${s.id.replace(/[^A-Za-z0-9-]+/g, '-')}`;
      return h(
        'li',
        { class: 'card', 'data-family': s.id },
        h('div', { class: 'card-head' }, h('h3', { id: headId }, s.id), h('span', { class: `kind kind-${f.params.kind}` }, s.kind)),
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
          { type: 'button', class: 'secondary', 'aria-describedby': headId, onclick: () => write(s.id) },
          'Write parameters at the selected cell',
        ),
      );
    }),
  );
}

async function writeFamily(shell: Shell, review: ReviewJob, id: string): Promise<void> {
  try {
    const f = getGrade(id);
    const plan = familyBlockPlan(f);
    const { sheet, topLeft } = await shell.selectionTopLeft();
    clearMessage();
    const record = await shell.safeWrite(plan, sheet, topLeft);
    if (!record) return;
    const ref = qualified(record.receipt.sheet, record.receipt.box);
    say(
      `Wrote the ${f.params.id} parameters to ${qualified(record.receipt.sheet, record.receipt.box, false)}. Edit the values to describe your grade and pass the range as the material of any DERATE function, e.g. =DERATE.MODULUS(${ref}, 80, "1000 h").`,
      'ok',
      review.offerBlock(record.receipt.sheet, record.receipt.box),
    );
  } catch (e) {
    say(describeError(e), 'error');
  }
}
