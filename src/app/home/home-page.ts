import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { catchError, of } from 'rxjs';
import { HealthApi } from '../core/health-api';

interface WorkStep {
  icon: string;
  title: string;
  text: string;
}

/** The first page: what Riffle does and for whom, and whether the service is up. */
@Component({
  selector: 'rf-home-page',
  imports: [MatCardModule, MatIconModule],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  protected readonly health = toSignal(
    inject(HealthApi)
      .getHealth()
      .pipe(catchError(() => of(null))),
  );

  protected readonly steps: readonly WorkStep[] = [
    {
      icon: 'straighten',
      title: 'Measure the site',
      text: 'Water level at the intake and at the discharge, the pipe route with its lengths and fittings, any spray or nozzle pressure.',
    },
    {
      icon: 'filter_alt',
      title: 'Plan the flow band',
      text: 'From the filtration you plan: flow per filter module, pond turnover per hour, or weir width for the sheet you want.',
    },
    {
      icon: 'show_chart',
      title: 'Find the operating point',
      text: 'The system curve from static lift, pipe friction and fitting losses meets each pump curve; Riffle reads the total dynamic head there.',
    },
    {
      icon: 'call_split',
      title: 'Choose the pumps',
      text: 'One pump or two in parallel, inside the preferred operating region around the best efficiency point, with the least energy, and still in band with one pump failed.',
    },
  ];
}
