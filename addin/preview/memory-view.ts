/**
 * Draws the in-memory workbook in the page when the pane runs outside Office: a grid with a contents
 * bar, sheet tabs, and the charts the pane added (drawn with chart.js, loaded only here).
 */
import { boxAddress, cellAddress, columnName, type Box } from '../sheet/a1.js';
import { byId, h } from '../shell/dom.js';
import type { MemoryWorkbook, StoredCell } from '../sheet/memory-sheet.js';
import { formatModulus, type ChartSpec } from '../sheet/port.js';

type ChartModule = typeof import('./chart-draw.js');
type ChartInstance = ReturnType<ChartModule['drawChart']>;

export function display(cell: StoredCell | undefined): string {
  if (!cell) return '';
  const v = cell.value;
  if (typeof v === 'number') return cell.format === 'modulus' ? formatModulus(v) : String(Math.round(v * 1e9) / 1e9);
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  return v;
}

export class MemoryView {
  private anchor = { row: 0, col: 0 };
  private readonly charts = new Map<string, ChartInstance>();
  private chartModule: Promise<ChartModule> | null = null;

  constructor(private readonly wb: MemoryWorkbook) {}

  mount(): void {
    byId('preview').hidden = false;
    document.body.classList.add('with-preview');
    const grid = byId('grid');
    grid.addEventListener('keydown', (e) => this.onGridKey(e));
    grid.addEventListener('mousedown', (e) => this.onGridClick(e));
    const input = byId<HTMLInputElement>('cell-input');
    input.addEventListener('keydown', (e) => {
      if (e.key === 'Enter') {
        e.preventDefault();
        this.commitInput(1);
      } else if (e.key === 'Escape') {
        e.preventDefault();
        this.showActive();
        grid.focus();
      }
    });
    this.wb.onChange(() => this.render());
    this.render();
  }

  private get box(): Box {
    return this.wb.activeBox;
  }

  private commitInput(down: number): void {
    const input = byId<HTMLInputElement>('cell-input');
    const b = this.box;
    this.wb.typeInto(this.wb.activeSheet, { row: b.top, col: b.left }, input.value);
    this.move(down, 0, false);
    byId('grid').focus();
  }

  /** Selects the box spanned by the anchor cell and (row, col), as a shift-click or shift-arrow does. */
  private selectFromAnchor(row: number, col: number): void {
    this.wb.select(this.wb.activeSheet, {
      top: Math.min(this.anchor.row, row),
      left: Math.min(this.anchor.col, col),
      bottom: Math.max(this.anchor.row, row),
      right: Math.max(this.anchor.col, col),
    });
  }

  private move(dr: number, dc: number, extend: boolean): void {
    const b = this.box;
    if (extend) {
      const far = { row: b.top === this.anchor.row ? b.bottom : b.top, col: b.left === this.anchor.col ? b.right : b.left };
      const row = Math.max(0, far.row + dr);
      const col = Math.max(0, far.col + dc);
      this.selectFromAnchor(row, col);
    } else {
      const row = Math.max(0, b.top + dr);
      const col = Math.max(0, b.left + dc);
      this.anchor = { row, col };
      this.wb.select(this.wb.activeSheet, { top: row, left: col, bottom: row, right: col });
    }
  }

  private onGridKey(e: KeyboardEvent): void {
    const moves: Record<string, [number, number]> = { ArrowUp: [-1, 0], ArrowDown: [1, 0], ArrowLeft: [0, -1], ArrowRight: [0, 1] };
    const m = moves[e.key];
    if (m) {
      e.preventDefault();
      this.move(m[0], m[1], e.shiftKey);
    } else if (e.key === 'Enter' || e.key === 'F2') {
      e.preventDefault();
      byId<HTMLInputElement>('cell-input').focus();
    } else if (e.key === 'Delete' || e.key === 'Backspace') {
      e.preventDefault();
      const b = this.box;
      for (let r = b.top; r <= b.bottom; r++)
        for (let c = b.left; c <= b.right; c++) this.wb.typeInto(this.wb.activeSheet, { row: r, col: c }, '');
    } else if (e.key.length === 1 && !e.ctrlKey && !e.metaKey && !e.altKey) {
      const input = byId<HTMLInputElement>('cell-input');
      input.value = '';
      input.focus();
    }
  }

  private onGridClick(e: MouseEvent): void {
    const td = (e.target as HTMLElement).closest('td[data-row]');
    if (!(td instanceof HTMLElement)) return;
    const row = Number(td.dataset.row);
    const col = Number(td.dataset.col);
    if (e.shiftKey) {
      this.selectFromAnchor(row, col);
    } else {
      this.anchor = { row, col };
      this.wb.select(this.wb.activeSheet, { top: row, left: col, bottom: row, right: col });
    }
    e.preventDefault();
    byId('grid').focus();
  }

  private showActive(): void {
    const b = this.box;
    const sheet = this.wb.activeSheet;
    byId('cell-name').textContent = `${sheet}!${boxAddress(b)}`;
    const cell = this.wb.cell(sheet, b.top, b.left);
    const input = byId<HTMLInputElement>('cell-input');
    if (document.activeElement !== input) input.value = cell ? String(cell.formula ?? cell.value) : '';
    const shown = cell?.formula ? `${display(cell)}` : '';
    byId('cell-value').textContent = shown ? `shows ${shown}` : '';
  }

  render(): void {
    const sheet = this.wb.activeSheet;
    const ext = this.wb.extent(sheet);
    const b = this.box;
    const rows = Math.max(ext.rows + 4, b.bottom + 4, 24);
    const cols = Math.max(ext.cols + 1, b.right + 2, 9);
    const head = h(
      'tr',
      {},
      h('th', { class: 'corner', scope: 'col' }, ''),
      ...Array.from({ length: cols }, (_, c) => h('th', { scope: 'col', class: c === 0 ? 'col-a' : null }, columnName(c))),
    );
    const body: HTMLTableRowElement[] = [];
    for (let r = 0; r < rows; r++) {
      const tds: HTMLElement[] = [h('th', { scope: 'row' }, String(r + 1))];
      for (let c = 0; c < cols; c++) {
        const cell = this.wb.cell(sheet, r, c);
        const text = display(cell);
        // Text runs over empty neighbours, as in a spreadsheet.
        let span = 1;
        if (typeof cell?.value === 'string' && text !== '') while (c + span < cols && !this.wb.cell(sheet, r, c + span)) span++;
        const inSel = r >= b.top && r <= b.bottom && c >= b.left && c <= b.right;
        const classes = [
          c === 0 ? 'col-a' : '',
          typeof cell?.value === 'number' ? 'num' : '',
          cell?.formula ? 'formula' : '',
          inSel ? 'sel' : '',
          r === b.top && c === b.left ? 'active' : '',
          text === 'pass' ? 'pass' : text === 'fail' ? 'fail' : '',
        ];
        tds.push(
          h(
            'td',
            {
              id: `cell-${r}-${c}`,
              role: 'gridcell',
              'data-row': r,
              'data-col': c,
              'aria-selected': inSel ? 'true' : 'false',
              class: classes.filter(Boolean).join(' '),
            },
            text
              ? h(
                  'span',
                  {
                    style: `max-width: calc(${span} * var(--col-width) + ${c === 0 ? 'var(--col-a-width) - var(--col-width)' : '0px'} - 8px)`,
                  },
                  text,
                )
              : null,
          ),
        );
      }
      body.push(h('tr', {}, ...tds));
    }
    const table = h('table', { class: 'cells' }, h('thead', {}, head), h('tbody', {}, ...body));
    const grid = byId('grid');
    grid.replaceChildren(table);
    grid.setAttribute('aria-activedescendant', `cell-${b.top}-${b.left}`);
    grid.setAttribute('aria-label', `Sheet ${sheet}, ${rows} rows by ${cols} columns; arrow keys move, Shift extends, Enter edits`);
    this.showActive();
    this.renderTabs();
    void this.renderCharts();
  }

  private renderTabs(): void {
    const tabs = byId('sheet-tabs');
    void this.wb.sheetNames().then((names) => {
      tabs.replaceChildren(
        ...names.map((n) =>
          h(
            'button',
            {
              type: 'button',
              class: n === this.wb.activeSheet ? 'sheet-tab current' : 'sheet-tab',
              'aria-pressed': n === this.wb.activeSheet ? 'true' : 'false',
              onclick: () => {
                this.anchor = { row: 0, col: 0 };
                this.wb.select(n, { top: 0, left: 0, bottom: 0, right: 0 });
              },
            },
            n,
          ),
        ),
      );
    });
  }

  private async renderCharts(): Promise<void> {
    const specs = this.wb.charts(this.wb.activeSheet);
    const host = byId('charts');
    const wanted = new Set(specs.map((s) => s.name));
    for (const [name, chart] of this.charts) {
      if (!wanted.has(name)) {
        chart.destroy();
        this.charts.delete(name);
        host.querySelector(`figure[data-chart="${CSS.escape(name)}"]`)?.remove();
      }
    }
    if (specs.length === 0) {
      host.hidden = true;
      return;
    }
    host.hidden = false;
    for (const spec of specs) {
      if (this.charts.has(spec.name)) continue;
      const canvas = h('canvas', { role: 'img', 'aria-label': chartDescription(spec) });
      const fig = h(
        'figure',
        { class: 'chart', 'data-chart': spec.name },
        h(
          'figcaption',
          {},
          `${spec.title} (drawn over ${spec.sheet}!${cellAddress({ row: spec.place.top, col: spec.place.left })} in Excel)`,
        ),
        h('div', { class: 'chart-box' }, canvas),
      );
      host.append(fig);
      const mod = await this.loadChartJs();
      if (!this.wb.charts(this.wb.activeSheet).includes(spec)) {
        fig.remove();
        continue;
      }
      this.charts.set(spec.name, mod.drawChart(canvas, spec));
    }
  }

  private loadChartJs(): Promise<ChartModule> {
    this.chartModule ??= import('./chart-draw.js');
    return this.chartModule;
  }

  /** Chart data as drawn, and its legend entries as chart.js laid them out, for the browser tests. */
  chartData(): {
    name: string;
    series: { label: string; points: { x: number; y: number }[]; showLine: boolean }[];
    legend: { text: string; pointStyle: string; lineDash: number[]; hidden: boolean }[];
    logY: boolean;
  }[] {
    return [...this.charts.entries()].map(([name, c]) => ({
      name,
      logY: (c.options.scales?.['y'] as { type?: string } | undefined)?.type === 'logarithmic',
      series: c.data.datasets.map((d) => ({ label: String(d.label), points: d.data, showLine: d.showLine !== false })),
      legend: (c.legend?.legendItems ?? []).map((l) => ({
        text: l.text,
        pointStyle: String(l.pointStyle),
        lineDash: l.lineDash ?? [],
        hidden: l.hidden === true,
      })),
    }));
  }
}

/** The chart in words for a screen reader: each candidate's curve by its ends, the markers by their points. */
function chartDescription(spec: ChartSpec): string {
  const mpa = (v: number | null | undefined): string => (v === null || v === undefined ? '-' : `${formatModulus(v)} MPa`);
  const parts = spec.series.map((s) => {
    const n = s.xValues.length;
    if (s.draw === 'curve' || s.draw === 'reference')
      return `${s.name}: ${mpa(s.yValues[0])} at ${s.xValues[0]} degC to ${mpa(s.yValues[n - 1])} at ${s.xValues[n - 1]} degC`;
    return `${s.name}: ${s.xValues.map((x, i) => `${mpa(s.yValues[i])} at ${Math.round(x * 10) / 10} degC`).join(', ')}`;
  });
  return `${spec.title}. ${parts.join('; ')}.`;
}
