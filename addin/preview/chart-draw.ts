/** The preview's chart drawing, with only the chart.js parts it uses (loaded on demand by memory-view.ts). */
import { Chart, Legend, LinearScale, LineController, LineElement, LogarithmicScale, PointElement, Tooltip } from 'chart.js';
import { formatModulus, type ChartSpec } from '../sheet/port.js';

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, Legend, Tooltip);

/** Series colours of the preview chart (our own palette); the reference line is drawn dark and dashed. */
const PALETTE = ['#0b6e69', '#c26a00', '#6c3f8f', '#2f5597', '#9c3b24', '#5b6e17', '#b0306a', '#3b7d3b', '#7a5c00', '#4a4a8a'];

export type DrawnChart = Chart<'line', { x: number; y: number }[]>;

export function drawChart(canvas: HTMLCanvasElement, spec: ChartSpec): DrawnChart {
  // The axis ends where the curves end (the chart-data span), not at the next round number past it.
  const xs = spec.series.filter((s) => s.draw === 'curve').flatMap((s) => s.xValues);
  let colour = 0;
  return new Chart<'line', { x: number; y: number }[]>(canvas, {
    type: 'line',
    data: {
      datasets: spec.series.map((s) => {
        // Markers take the colour of no one candidate: they sit on the curves they belong to.
        const c =
          s.draw === 'reference'
            ? '#30343a'
            : s.draw === 'points'
              ? '#1d1f22'
              : s.draw === 'limits'
                ? '#b00020'
                : (PALETTE[colour++ % PALETTE.length] ?? '#000');
        const markers = s.draw === 'points' || s.draw === 'limits';
        return {
          label: s.name,
          data: s.xValues.flatMap((x, i) => {
            const y = s.yValues[i];
            return y === null || y === undefined ? [] : [{ x, y }];
          }),
          borderColor: c,
          backgroundColor: s.draw === 'points' ? '#ffffff' : c,
          borderDash: s.draw === 'reference' ? [6, 4] : [],
          showLine: !markers,
          // The legend draws each entry as its series looks: a line (dashed for the required stiffness) or the marker.
          pointStyle: s.draw === 'limits' ? 'rectRot' : s.draw === 'points' ? 'circle' : 'line',
          pointRadius: s.draw === 'limits' ? 6 : s.draw === 'points' ? 3.5 : 0,
          pointHoverRadius: markers ? 7 : 3,
          borderWidth: markers ? 1.5 : 2,
          order: markers ? 0 : 1,
        };
      }),
    },
    options: {
      animation: false,
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      plugins: {
        legend: {
          position: 'bottom',
          labels: {
            usePointStyle: true,
            pointStyleWidth: 26,
            boxHeight: 8,
            // In the order of the series (drawing order puts the markers on top, but the legend lists curves first).
            sort: (a, b) => (a.datasetIndex ?? 0) - (b.datasetIndex ?? 0),
            // With point styles chart.js takes the legend's dash from the point, which has none: give the required line its dash.
            generateLabels: (chart) =>
              Chart.defaults.plugins.legend.labels
                .generateLabels(chart)
                .map((l) => (spec.series[l.datasetIndex ?? -1]?.draw === 'reference' ? { ...l, lineDash: [6, 4] } : l)),
          },
        },
        tooltip: {
          callbacks: {
            label: (item) =>
              `${item.dataset.label ?? ''}: ${formatModulus(item.parsed.y ?? NaN)} MPa at ${Math.round((item.parsed.x ?? NaN) * 10) / 10} degC`,
          },
        },
      },
      scales: {
        x: {
          type: 'linear',
          min: xs.length ? Math.min(...xs) : undefined,
          max: xs.length ? Math.max(...xs) : undefined,
          title: { display: true, text: spec.xTitle },
        },
        y: { type: spec.logY ? 'logarithmic' : 'linear', min: spec.yMin, title: { display: true, text: spec.yTitle } },
      },
    },
  });
}
