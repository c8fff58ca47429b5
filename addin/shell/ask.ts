/** The pane's own question box: Office add-ins cannot use window.confirm. */
import { byId, h } from './dom.js';

/** One answer offered; its id is what ask() resolves with, and its button's element id is `ask-<id>`. */
export interface Choice {
  readonly id: string;
  readonly label: string;
  readonly primary?: boolean;
}

/** Shows a question in the pane and resolves with the id of the choice ('cancel' on Escape). */
export function ask(title: string, text: string, choices: readonly Choice[]): Promise<string> {
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
