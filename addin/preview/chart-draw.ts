/** The preview's chart drawing, with only the chart.js parts it uses (loaded on demand by memory-view.ts). */
import { Chart, Legend, LinearScale, LineController, LineElement, LogarithmicScale, PointElement, Tooltip } from 'chart.js';
import { formatModulus, type ChartSpec } from '../sheet/port.js';

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, Legend, Tooltip);

/** Series colours of the preview chart (our own palette); the reference line is drawn dark and dashed. */
const PALETTE = ['#0b6e69', '#c26a00', '#6c3f8f', '#2f5597', '#9c3b24', '#5b6e17', '#b0306a', '#3b7d3b', '#7a5c00', '#4a4a8a'];

export type DrawnChart = Chart<'line', { x: number; y: number }[]>;

export function drawChart(canvas: HTMLCanvasElement, spec: ChartSpec): DrawnChart {
  let colour = 0;
  return new Chart<'line', { x: number; y: number }[]>(canvas, {
    type: 'line',
    data: {
      datasets: spec.series.map((s) => {
        const c = s.reference ? '#30343a' : (PALETTE[colour++ % PALETTE.length] ?? '#000');
        return {
          label: s.name,
          data: s.xValues.map((x, i) => ({ x, y: s.yValues[i] ?? NaN })),
          borderColor: c,
          backgroundColor: c,
          borderDash: s.reference ? [6, 4] : [],
          pointRadius: s.reference ? 0 : 3,
          borderWidth: 2,
        };
      }),
    },
    options: {
      animation: false,
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      plugins: {
        legend: { position: 'bottom', labels: { boxWidth: 14 } },
        tooltip: {
          callbacks: {
            label: (item) => `${item.dataset.label ?? ''}: ${formatModulus(item.parsed.y ?? NaN)} MPa at ${item.parsed.x} degC`,
          },
        },
      },
      scales: {
        x: { type: 'linear', title: { display: true, text: spec.xTitle } },
        y: { type: spec.logY ? 'logarithmic' : 'linear', min: spec.yMin, title: { display: true, text: spec.yTitle } },
      },
    },
  });
}
