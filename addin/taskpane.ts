/// <reference types="office-js" />
/**
 * The task pane's entry (bundled to dist/taskpane.js): picks the sheet (Excel through Office.js; anywhere
 * else, as in the preview and the browser tests, the in-memory sheet drawn beside the pane), then starts the
 * shell (shell/) and the three jobs (jobs/lookup, jobs/review, jobs/calibrate).
 */
import { setUpCalibrate } from './jobs/calibrate/pane.js';
import { setUpLookup } from './jobs/lookup/pane.js';
import { CAUTION } from './jobs/notes.js';
import { setUpReview } from './jobs/review/pane.js';
import { MemoryWorkbook } from './sheet/memory-sheet.js';
import { MemoryView } from './preview/memory-view.js';
import { OfficeSheet } from './sheet/office-sheet.js';
import type { SheetPort } from './sheet/port.js';
import { byId } from './shell/dom.js';
import { describeError, say } from './shell/messages.js';
import { Shell } from './shell/shell.js';

declare global {
  interface Window {
    /** Set whenever the in-page sheet is used (the preview, or the add-in page opened outside Excel), for the browser tests. */
    resinDeratePreview?: { workbook: MemoryWorkbook; view: MemoryView };
  }
}

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
  if (port instanceof MemoryWorkbook) {
    const view = new MemoryView(port);
    view.mount();
    window.resinDeratePreview = { workbook: port, view };
  }
  const shell = new Shell(port);
  byId('host-note').textContent = note;
  byId('caution-text').textContent = CAUTION;
  shell.mount();
  // The review first: the other two jobs offer it the blocks they write.
  const review = setUpReview(shell);
  setUpLookup(shell, review);
  setUpCalibrate(shell, review);
  await shell.watchSelection();
  document.body.dataset.ready = 'true';
}

void start().catch((e: unknown) => {
  document.body.dataset.ready = 'failed';
  say(`The pane could not start: ${describeError(e)}`, 'error');
});
