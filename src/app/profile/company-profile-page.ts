import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { CompanyProfile } from '../../../shared/api/api-schemas';
import { describeHttpError } from '../core/problem-details';
import { ReportsApi } from './reports-api';

/** The company profile that heads every proposal: contact lines and the logo (PNG or JPEG, at most 1 MiB). */
@Component({
  selector: 'rf-company-profile-page',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section class="rf-card rf-company-profile" aria-labelledby="rf-company-profile-title">
      <h1 id="rf-company-profile-title">Company profile</h1>
      <p class="rf-muted">These lines and the logo head every proposal PDF you make.</p>
      <form [formGroup]="form" (ngSubmit)="save()" novalidate>
        <mat-form-field appearance="outline">
          <mat-label>Company name</mat-label>
          <input matInput formControlName="name" maxlength="200" autocomplete="organization" />
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Address</mat-label>
          <textarea
            matInput
            formControlName="address"
            rows="3"
            maxlength="400"
            autocomplete="street-address"
          ></textarea>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Phone</mat-label>
          <input matInput formControlName="phone" maxlength="40" autocomplete="tel" />
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>E-mail</mat-label>
          <input matInput type="email" formControlName="email" maxlength="254" autocomplete="email" />
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Licence number</mat-label>
          <input matInput formControlName="licenceNumber" maxlength="60" />
        </mat-form-field>
        <div class="rf-company-profile-actions">
          <button mat-flat-button type="submit" [disabled]="busy()">Save the profile</button>
        </div>
      </form>
      <h2>Logo</h2>
      @if (logoUrl(); as url) {
        <img class="rf-company-logo" [src]="url" alt="Your company logo" />
      }
      @if (profile()?.logo; as logo) {
        <p class="rf-muted">
          {{ logo.type === 'image/png' ? 'PNG' : 'JPEG' }}, {{ logo.width }} x {{ logo.height }} pixels
        </p>
      }
      <label class="rf-company-profile-actions">
        <span>PNG or JPEG, at most 1 MiB and 4000 x 4000 pixels:</span>
        <input type="file" accept="image/png,image/jpeg" (change)="upload($event)" [disabled]="busy()" />
      </label>
      @if (problem(); as message) {
        <p class="rf-company-profile-problem" role="alert">{{ message }}</p>
      }
      @if (note(); as message) {
        <p role="status">{{ message }}</p>
      }
    </section>
  `,
  styles: `
    .rf-company-profile {
      max-width: 40rem;
      form {
        display: flex;
        flex-direction: column;
      }
    }
    .rf-company-profile-actions {
      display: flex;
      flex-wrap: wrap;
      gap: 0.75rem;
      align-items: center;
    }
    .rf-company-logo {
      max-width: 240px;
      max-height: 120px;
    }
    .rf-company-profile-problem {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompanyProfilePage {
  private readonly api = inject(ReportsApi);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', Validators.maxLength(200)],
    address: ['', Validators.maxLength(400)],
    phone: ['', [Validators.maxLength(40), Validators.pattern(/^[0-9+()./ -]*$/)]],
    email: ['', [Validators.maxLength(254), Validators.email]],
    licenceNumber: ['', Validators.maxLength(60)],
  });
  protected readonly profile = signal<CompanyProfile | null>(null);
  protected readonly logoUrl = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly note = signal<string | null>(null);

  constructor() {
    inject(DestroyRef).onDestroy(() => this.showLogo(null));
    this.api.getProfile().subscribe((profile) => this.shown(profile));
  }

  private shown(profile: CompanyProfile): void {
    this.profile.set(profile);
    const { name, address, phone, email, licenceNumber } = profile;
    this.form.setValue({ name, address, phone, email, licenceNumber });
    if (profile.logo) this.api.getLogo().subscribe((blob) => this.showLogo(URL.createObjectURL(blob)));
  }

  private showLogo(url: string | null): void {
    const previous = this.logoUrl();
    if (previous) URL.revokeObjectURL(previous);
    this.logoUrl.set(url);
  }

  private failed(error: HttpErrorResponse): void {
    this.busy.set(false);
    this.problem.set(describeHttpError(error));
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.note.set(null);
    this.api.updateProfile(this.form.getRawValue()).subscribe({
      next: (profile) => {
        this.busy.set(false);
        this.profile.set(profile);
        this.note.set('The profile is saved.');
      },
      error: (error: HttpErrorResponse) => this.failed(error),
    });
  }

  protected upload(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    if (!file) return;
    this.busy.set(true);
    this.problem.set(null);
    this.note.set(null);
    this.api.uploadLogo(file).subscribe({
      next: (profile) => {
        this.busy.set(false);
        input.value = '';
        this.shown(profile);
        this.note.set('The logo is saved.');
      },
      error: (error: HttpErrorResponse) => {
        input.value = '';
        this.failed(error);
      },
    });
  }
}
