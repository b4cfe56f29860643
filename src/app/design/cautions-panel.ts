import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { DESIGN_CAUTIONS } from '../../../shared/messages/design-cautions';

/** The safety and scope notes shown wherever a design result could be acted on. */
@Component({
  selector: 'rf-cautions-panel',
  imports: [MatIconModule],
  template: `
    <aside class="rf-design-cautions" aria-label="Cautions">
      <h2><mat-icon aria-hidden="true">warning_amber</mat-icon> Before anything is built or wired</h2>
      <ul>
        @for (caution of cautions; track caution.title) {
          <li>
            <strong>{{ caution.title }}</strong> {{ caution.text }}
          </li>
        }
      </ul>
    </aside>
  `,
  styles: `
    .rf-design-cautions {
      border-left: 4px solid var(--rf-copper);
      background: #fff8f1;
      padding: 0.75rem 1.25rem;
      margin-top: 2rem;
      border-radius: 4px;
      h2 {
        display: flex;
        gap: 0.5rem;
        align-items: center;
        font-size: 1.05rem;
        margin: 0.25rem 0 0.5rem;
      }
      li {
        margin-bottom: 0.35rem;
        line-height: 1.4;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionsPanel {
  protected readonly cautions = DESIGN_CAUTIONS;
}
