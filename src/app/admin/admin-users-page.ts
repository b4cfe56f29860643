import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import type { AdminUser, AdminUserList, InvitationSummary, Role, UserChanges } from '../../../shared/api/api-schemas';
import { describeHttpError } from '../core/problem-details';
import { SessionService } from '../core/session-service';
import { AdminApi } from './admin-api';
import { roleChoices } from '../core/role-labels';

/** Invite people by e-mail and role; change roles and supplier bindings; disable accounts. */
@Component({
  selector: 'rf-admin-users-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatCardModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatSlideToggleModule,
    MatTableModule,
  ],
  templateUrl: './admin-users-page.html',
  styleUrl: './admin-users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdminUsersPage {
  private readonly adminApi = inject(AdminApi);
  private readonly session = inject(SessionService);
  protected readonly myId = computed(() => this.session.user()?.id);
  protected readonly roleChoices = roleChoices;
  protected readonly columns = ['name', 'email', 'role', 'supplier', 'disabled', 'createdAt'];

  protected readonly list = signal<AdminUserList>({ users: [], suppliers: [] });
  protected readonly invitations = signal<InvitationSummary[]>([]);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected readonly inviteForm = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    role: ['designer' as Role, Validators.required],
    supplierId: [null as number | null],
  });
  private readonly invitedRole = toSignal(this.inviteForm.controls.role.valueChanges, {
    initialValue: this.inviteForm.controls.role.value,
  });
  protected readonly inviteNeedsSupplier = computed(() => this.invitedRole() === 'supplier-admin');

  constructor() {
    this.reload();
  }

  protected supplierName(supplierId: number | null): string {
    return this.list().suppliers.find((supplier) => supplier.id === supplierId)?.name ?? '';
  }

  protected invite(formDirective: FormGroupDirective): void {
    const { email, role, supplierId } = this.inviteForm.getRawValue();
    if (this.inviteForm.invalid || (role === 'supplier-admin' && supplierId === null)) {
      this.inviteForm.markAllAsTouched();
      if (role === 'supplier-admin' && supplierId === null)
        this.inviteForm.controls.supplierId.setErrors({ required: true });
      return;
    }
    this.problem.set(null);
    this.adminApi.inviteUser({ email, role, supplierId: role === 'supplier-admin' ? supplierId : null }).subscribe({
      next: (invitation) => {
        this.notice.set(
          `Invitation e-mailed to ${invitation.email}; the link works once, until ${new Date(invitation.expiresAt).toLocaleDateString()}.`,
        );
        formDirective.resetForm({ email: '', role: 'designer', supplierId: null });
        this.reload();
      },
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }

  protected changeRole(user: AdminUser, role: Role): void {
    const supplierId = role === 'supplier-admin' ? (user.supplierId ?? this.list().suppliers[0]?.id ?? null) : null;
    this.update(user, { role, supplierId });
  }

  protected changeSupplier(user: AdminUser, supplierId: number): void {
    this.update(user, { supplierId });
  }

  protected setDisabled(user: AdminUser, disabled: boolean): void {
    this.update(user, { disabled });
  }

  private update(user: AdminUser, changes: UserChanges): void {
    this.problem.set(null);
    this.adminApi.updateUser(user.id, changes).subscribe({
      next: (updated) => {
        this.list.update((list) => ({
          ...list,
          users: list.users.map((candidate) => (candidate.id === updated.id ? updated : candidate)),
        }));
        this.notice.set(`Saved ${updated.email}.`);
      },
      error: (error: HttpErrorResponse) => {
        this.problem.set(describeHttpError(error));
        this.reload();
      },
    });
  }

  private reload(): void {
    this.adminApi.listUsers().subscribe((list) => this.list.set(list));
    this.adminApi.listInvitations().subscribe(({ invitations }) => this.invitations.set(invitations));
  }
}
