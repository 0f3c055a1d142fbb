// A bar chart drawn by chart.js on a canvas: money arrives as decimal strings and is shown through the money formatter;
// it becomes a JS number only for the bars' lengths on screen, never for a figure a person reads.
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterRenderEffect, inject, input, output, viewChild } from '@angular/core';
import { BarController, BarElement, CategoryScale, Chart, Legend, LinearScale, Tooltip, type ChartConfiguration } from 'chart.js';

// Only what a bar chart needs, so the lazy chunk stays small.
Chart.register(BarController, BarElement, CategoryScale, LinearScale, Tooltip, Legend);
Chart.defaults.font.family = "'Work Sans', system-ui, sans-serif";
Chart.defaults.color = '#4b4641';

export interface ChartSeries {
  label: string;
  /** Decimal strings, one per category. */
  values: readonly string[];
  color: string;
  /** Drawn as an outline only (a budget is a limit, not money spent). */
  outline?: boolean;
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
    const datasets = series.map((one) => ({
      label: one.label,
      data: one.values.map((value) => Number(value)),
      backgroundColor: one.outline ? 'transparent' : one.color,
      borderColor: one.color,
      borderWidth: one.outline ? 2 : 0,
      borderRadius: 3,
      maxBarThickness: 28,
    }));
    if (this.chart) {
      this.chart.data.labels = categories;
      this.chart.data.datasets = datasets;
      this.chart.options.indexAxis = horizontal ? 'y' : 'x';
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
      options: {
        indexAxis: horizontal ? 'y' : 'x',
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        plugins: {
          legend: { position: 'top', align: 'start', labels: { boxWidth: 14, color: '#1d1b19' } },
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
