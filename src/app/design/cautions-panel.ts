import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The safety and scope notes shown wherever a design result could be acted on. */
@Component({
  selector: 'rf-cautions-panel',
  imports: [MatIconModule],
  template: `
    <aside class="rf-design-cautions" aria-label="Cautions">
      <h2><mat-icon aria-hidden="true">warning_amber</mat-icon> Before anything is built or wired</h2>
      <ul>
        <li>
          <strong>Electricity near water.</strong> Ground-fault (GFCI/RCD) protection, pumps and cords listed for wet
          locations and bonding as the local electrical code requires; a licensed electrician where the code asks for
          one; lock out the power before anyone touches a pump or reaches into the water.
        </li>
        <li>
          <strong>Suction and drowning.</strong> Intakes people or animals can reach need covers, split drains or vacuum
          relief against entrapment.
        </li>
        <li>
          <strong>Running the pumps.</strong> No dry running and no running against a closed valve; a check valve on
          every parallel pump; close valves slowly to spare the pipe from water hammer.
        </li>
        <li>
          <strong>Suction lift and priming.</strong> An external pump standing above the water it draws must be
          self-priming, or be primed and kept full with a foot valve on the suction pipe; a flooded suction (pump below
          the water) avoids both. Defer to the pump maker's data for the lift and NPSH it needs.
        </li>
        <li>
          <strong>Vaults, wet wells and trenches</strong> are confined spaces and excavations: follow the entry and
          shoring rules that apply.
        </li>
        <li>
          <strong>Estimates, not guarantees.</strong> Every figure here is a design estimate from published curves and
          textbook formulas: verify it against the pump maker's data, local codes and licensed practice before ordering
          or building.
        </li>
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
export class CautionsPanel {}
