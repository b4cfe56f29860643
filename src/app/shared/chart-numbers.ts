import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { formatFigure } from './locale-numbers';

/** One table of a chart's numbers: its caption, column headings (with units) and rows of figures as shown. */
export interface NumberTable {
  caption: string;
  headers: readonly string[];
  rows: ReadonlyArray<readonly string[]>;
}

/** A figure with at most `digits` decimals in the user's locale, or a dash when there is none. */
export function figure(value: number | null | undefined, digits = 1): string {
  return formatFigure(value, `1.0-${digits}`);
}

/** At most `most` items of `items`, evenly spaced, always with the first and the last. */
export function evenlyPicked<T>(items: readonly T[], most: number): T[] {
  if (items.length <= most) return [...items];
  return Array.from({ length: most }, (_, index) => items[Math.round((index * (items.length - 1)) / (most - 1))]);
}

/**
 * The numbers a chart draws, as tables beside it: collapsed under a summary the keyboard and screen
 * readers reach, so who cannot see the picture reads the same figures, and anyone can copy them.
 */
@Component({
  selector: 'rf-chart-numbers',
  template: `<details class="rf-chart-numbers">
    <summary>{{ summary() }}</summary>
    @for (table of tables(); track table.caption) {
      <div class="rf-chart-numbers-scroll">
        <table>
          <caption>
            {{
              table.caption
            }}
          </caption>
          <thead>
            <tr>
              @for (header of table.headers; track $index) {
                <th scope="col">{{ header }}</th>
              }
            </tr>
          </thead>
          <tbody>
            @for (row of table.rows; track $index) {
              <tr>
                @for (cell of row; track $index) {
                  @if ($first) {
                    <th scope="row">{{ cell }}</th>
                  } @else {
                    <td>{{ cell }}</td>
                  }
                }
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  </details>`,
  styles: `
    :host {
      display: block;
      margin-top: 0.5rem;
    }
    summary {
      cursor: pointer;
      font-weight: 600;
      padding: 0.25rem 0;
    }
    .rf-chart-numbers-scroll {
      overflow-x: auto;
    }
    table {
      border-collapse: collapse;
      margin: 0.5rem 0 0.75rem;
      font-variant-numeric: tabular-nums;
    }
    caption {
      text-align: left;
      font-weight: 600;
      padding-bottom: 0.25rem;
    }
    th,
    td {
      border-bottom: 1px solid rgb(0 0 0 / 12%);
      padding: 0.2rem 0.6rem;
      text-align: right;
      white-space: nowrap;
    }
    th[scope='row'],
    thead th:first-child {
      text-align: left;
    }
    @media print {
      :host {
        display: none;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartNumbers {
  readonly tables = input.required<readonly NumberTable[]>();
  readonly summary = input('Numbers of this chart');
}
