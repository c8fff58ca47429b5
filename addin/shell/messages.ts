/** The pane's message line: what happened, in words, and errors turned into sentences that name the field. */
import { InputError, ParameterError, UnknownFamilyError } from '../../src/base/errors.js';
import { byId, h } from './dom.js';

/** Shows a message (and an optional button or other element under it) in the pane's message line. */
export function say(text: string, kind: 'ok' | 'error' | 'info' = 'info', extra?: HTMLElement): void {
  const box = byId('status');
  box.className = `status ${kind}`;
  box.setAttribute('role', kind === 'error' ? 'alert' : 'status');
  box.replaceChildren(h('p', {}, text), ...(extra ? [extra] : []));
  box.scrollIntoView({ block: 'nearest' });
}

/** Empties the message line (before a write, so an old message does not sit beside a new question). */
export function clearMessage(): void {
  byId('status').replaceChildren();
}

/** An error as a sentence for the message line: input errors lead with the argument they name. */
export function describeError(e: unknown): string {
  if (e instanceof InputError) return `${capital(e.argument)}: ${e.problem}`;
  if (e instanceof ParameterError || e instanceof UnknownFamilyError) return capital(e.message);
  return e instanceof Error ? e.message : String(e);
}

/** The text with its first letter in upper case. */
export function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
