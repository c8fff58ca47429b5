/** The job tabs: the ARIA tabs pattern, arrow keys, Home and End moving between them. */
import { byId } from './dom.js';

/** Wires every [role=tab] button to its panel; onShow gets the tab and its panel each time one is shown. */
export function setUpTabs(onShow: (tab: HTMLButtonElement, panel: HTMLElement) => void): void {
  const tabs = Array.from(document.querySelectorAll<HTMLButtonElement>('[role=tab]'));
  const show = (tab: HTMLButtonElement, focus: boolean): void => {
    for (const t of tabs) {
      const on = t === tab;
      t.setAttribute('aria-selected', on ? 'true' : 'false');
      t.tabIndex = on ? 0 : -1;
      byId(t.getAttribute('aria-controls') ?? '').hidden = !on;
    }
    if (focus) tab.focus();
    onShow(tab, byId(tab.getAttribute('aria-controls') ?? ''));
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
