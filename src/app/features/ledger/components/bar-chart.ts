// A bar chart drawn by chart.js on a canvas: money arrives as decimal strings and is shown through the money formatter;
// it becomes a JS number only for the bars' lengths on screen, never for a figure a person reads. A limit (a budget) is
// a marker across its category (chartjs-plugin-annotation), and each bar can carry its figure (chartjs-plugin-datalabels).
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterRenderEffect, inject, input, output, viewChild } from '@angular/core';
import { BarController, BarElement, CategoryScale, Chart, Legend, LinearScale, Tooltip, type ChartConfiguration, type LegendItem } from 'chart.js';
import annotationPlugin, { type AnnotationOptions } from 'chartjs-plugin-annotation';
import ChartDataLabels from 'chartjs-plugin-datalabels';

// Only what a bar chart needs, so the lazy chunk stays small.
Chart.register(BarController, BarElement, CategoryScale, LinearScale, Tooltip, Legend, annotationPlugin);
Chart.defaults.font.family = "'Work Sans', system-ui, sans-serif";
Chart.defaults.color = '#4b4641';

export interface ChartSeries {
  label: string;
  /** Decimal strings, one per category. */
  values: readonly string[];
  color: string;
}

/** A limit per category (a system's budget), drawn as a line across the category's bars; a zero draws nothing. */
export interface ChartMarker {
  label: string;
  values: readonly string[];
  color: string;
}

/** About what fits a third of a phone's chart on one line of axis labels. */
const LABEL_LINE_CHARACTERS = 14;

/** A category's name in lines of whole words, each at most `width` characters unless one word is longer. */
export function wrapLabel(label: string, width: number): string[] {
  const lines: string[] = [];
  for (const word of label.split(/\s+/).filter(Boolean)) {
    const last = lines.length - 1;
    if (last >= 0 && lines[last].length + 1 + word.length <= width) lines[last] += ` ${word}`;
    else lines.push(word);
  }
  return lines.length > 0 ? lines : [''];
}

export interface BarClick {
  seriesIndex: number;
  index: number;
}

@Component({
  selector: 'th-bar-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './bar-chart.html',
  styleUrl: './bar-chart.css',
})
export class BarChart {
  readonly categories = input.required<readonly string[]>();
  readonly series = input.required<readonly ChartSeries[]>();
  readonly marker = input<ChartMarker | null>(null);
  /** Each bar's figure printed at its end (zeros left blank). */
  readonly valuesOnBars = input(false);
  /** Bars running left to right, categories down the side (systems); otherwise upright (periods). */
  readonly horizontal = input(false);
  readonly height = input(280);
  /** What the chart shows in words, for screen readers; the table beside it carries the figures. */
  readonly summary = input.required<string>();
  readonly format = input.required<(amount: string) => string>();
  /** The value axis's labels: whole currency units (see wholeMoneyText); the bars' own figures keep their cents. */
  readonly axisFormat = input.required<(value: number) => string>();
  readonly barClick = output<BarClick>();

  private readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  private chart: Chart<'bar'> | null = null;

  constructor() {
    afterRenderEffect(() => this.draw());
    inject(DestroyRef).onDestroy(() => {
      this.chart?.destroy();
      this.chart = null;
    });
  }

  private draw(): void {
    const categories = [...this.categories()];
    const series = this.series();
    const format = this.format();
    const axisFormat = this.axisFormat();
    const horizontal = this.horizontal();
    const marker = this.marker();
    const valuesOnBars = this.valuesOnBars();
    const datasets = series.map((one) => ({
      label: one.label,
      data: one.values.map((value) => Number(value)),
      backgroundColor: one.color,
      borderWidth: 0,
      borderRadius: 3,
      maxBarThickness: 28,
    }));
    const annotations = markerLines(marker, horizontal);
    if (this.chart) {
      this.chart.data.labels = categories;
      this.chart.data.datasets = datasets;
      this.chart.options.indexAxis = horizontal ? 'y' : 'x';
      this.chart.options.plugins!.annotation = { annotations };
      this.chart.update();
      return;
    }
    const element = this.canvas().nativeElement;
    // No drawing context (a test's DOM without canvas): the table beside the chart still shows every figure.
    const context = element.getContext('2d');
    if (!context) return;
    const config: ChartConfiguration<'bar'> = {
      type: 'bar',
      data: { labels: categories, datasets },
      plugins: valuesOnBars ? [ChartDataLabels] : [],
      options: {
        indexAxis: horizontal ? 'y' : 'x',
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        // Room at the bars' far end for their figures.
        layout: { padding: valuesOnBars ? (horizontal ? { right: 84 } : { top: 24 }) : 0 },
        plugins: {
          legend: {
            position: 'top',
            align: 'start',
            // A marker's entry has no dataset to hide.
            onClick: (event, item, legend) => {
              if (item.datasetIndex !== undefined) Chart.defaults.plugins.legend.onClick.call(legend, event, item, legend);
            },
            labels: {
              boxWidth: 14,
              color: '#1d1b19',
              // The marker has no dataset: its legend entry is added here, drawn as the line it is.
              generateLabels: (chart) => [...Chart.defaults.plugins.legend.labels.generateLabels(chart), ...markerLegend(this.marker())],
            },
          },
          annotation: { annotations },
          datalabels: {
            display: (context) => valuesOnBars && Number(context.dataset.data[context.dataIndex]) !== 0,
            anchor: 'end',
            align: 'end',
            offset: 2,
            clamp: true,
            color: '#1d1b19',
            font: { size: 12, family: "'Work Sans', system-ui, sans-serif" },
            // The formatted decimal string, not the float the bar was drawn from.
            formatter: (_value, context) => format(this.series()[context.datasetIndex]?.values[context.dataIndex] ?? '0'),
          },
          tooltip: {
            callbacks: {
              // The formatted decimal string, not the float the bar was drawn from.
              label: (item) => `${item.dataset.label}: ${format(this.series()[item.datasetIndex]?.values[item.dataIndex] ?? '0')}`,
            },
          },
        },
        scales: {
          [horizontal ? 'x' : 'y']: {
            beginAtZero: true,
            ticks: { color: '#4b4641', maxRotation: 0, autoSkipPadding: 16, callback: (value) => axisFormat(Number(value)) },
            grid: { color: '#e8e1db' },
          },
          // A long name (a shop's, on a phone) goes on lines of its own words rather than off the canvas's edge.
          [horizontal ? 'y' : 'x']: {
            ticks: { color: '#1d1b19', callback: (_value, index) => wrapLabel(this.categories()[index] ?? '', LABEL_LINE_CHARACTERS) },
            grid: { display: false },
          },
        },
        onClick: (_event, elements) => {
          const hit = elements[0];
          if (hit) this.barClick.emit({ seriesIndex: hit.datasetIndex, index: hit.index });
        },
        onHover: (event, elements) => {
          const target = event.native?.target as HTMLElement | undefined;
          if (target) target.style.cursor = elements.length ? 'pointer' : 'default';
        },
      },
    };
    this.chart = new Chart(context, config);
  }
}

/** One line per category with a limit: across the category's band, at the limit's value. */
function markerLines(marker: ChartMarker | null, horizontal: boolean): Record<string, AnnotationOptions> {
  const lines: Record<string, AnnotationOptions> = {};
  marker?.values.forEach((value, index) => {
    const at = Number(value);
    if (at === 0) return;
    const across = { min: index - 0.42, max: index + 0.42 };
    lines[`marker${index}`] = horizontal
      ? { type: 'line', xMin: at, xMax: at, yMin: across.min, yMax: across.max, borderColor: marker.color, borderWidth: 3 }
      : { type: 'line', yMin: at, yMax: at, xMin: across.min, xMax: across.max, borderColor: marker.color, borderWidth: 3 };
  });
  return lines;
}

function markerLegend(marker: ChartMarker | null): LegendItem[] {
  if (!marker) return [];
  return [{ text: marker.label, fillStyle: marker.color, strokeStyle: marker.color, lineWidth: 0, fontColor: '#1d1b19', hidden: false, datasetIndex: undefined }];
}
