// /builds/:buildId/crew: who is on the build; the owner changes roles, removes people and invites more.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import { filter, switchMap } from 'rxjs';
import { InviteDto, MemberDto, inviteRequest } from '../../../../../shared/api/builds';
import { BUILD_ROLES, BuildRole, INVITABLE_ROLES, InvitableRole, ROLE_LABELS } from '../../../../../shared/enums';
import { Session } from '../../../core/auth/session';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { confirmAction } from '../../../ui/confirm-dialog';
import { CrewApi } from '../services/crew-api';

/** What each invitable role may do, in one line (DESIGN §2). */
const ROLE_EXPLANATIONS: Record<InvitableRole, string> = {
  crew: 'Helps in the shop: uploads receipts, edits parts and lines; no budgets, members or deleting the build.',
  reviewer: 'Partner, customer or accountant: sees everything, approves or questions receipts, comments and exports; changes no money.',
};

@Component({
  selector: 'th-crew-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './crew-page.html',
  styleUrl: './crew-page.css',
})
export class CrewPage {
  private readonly crewApi = inject(CrewApi);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly errorOf = errorOf;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly roleExplanations = ROLE_EXPLANATIONS;
  protected readonly allRoles = BUILD_ROLES;
  protected readonly invitableRoles = INVITABLE_ROLES;

  protected readonly members = signal<MemberDto[]>([]);
  protected readonly invites = signal<InviteDto[]>([]);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);

  protected readonly myUserId = computed(() => this.session.user()?.id ?? null);
  /** The person's own role, read from the member list (the server decides; this only shapes the screen). */
  protected readonly myRole = computed<BuildRole | null>(
    () => this.members().find((member) => member.userId === this.myUserId())?.role ?? null,
  );
  protected readonly isOwner = computed(() => this.myRole() === 'owner');
  protected readonly columns = computed(() => (this.isOwner() ? ['name', 'email', 'role', 'actions'] : ['name', 'email', 'role']));

  protected readonly inviteForm = inject(NonNullableFormBuilder).group({
    email: '',
    role: 'crew' as InvitableRole,
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  /** Table rows are untyped in templates; this keeps the lookup typed. */
  protected roleLabelOf(member: MemberDto): string {
    return ROLE_LABELS[member.role];
  }

  protected formatDay(timestamp: string): string {
    const date = new Date(timestamp);
    return Number.isNaN(date.getTime()) ? timestamp : new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' }).format(date);
  }

  protected sendInvite(): void {
    const request = validateWith(this.inviteForm, inviteRequest, this.inviteForm.getRawValue());
    if (!request || this.busy()) return;
    this.busy.set(true);
    this.crewApi.invite(this.buildId(), request).subscribe({
      next: (invite) => {
        this.busy.set(false);
        this.invites.update((invites) => [...invites.filter((existing) => existing.id !== invite.id), invite]);
        this.inviteForm.reset({ email: '', role: request.role });
        this.snackBar.open(`Invite sent to ${invite.email}.`, 'Dismiss', { duration: 6000 });
      },
      error: (error: unknown) => {
        applyFieldErrors(this.inviteForm, toApiError(error).fields);
        this.busy.set(false);
      },
    });
  }

  protected withdraw(invite: InviteDto): void {
    this.busy.set(true);
    this.crewApi.withdrawInvite(this.buildId(), invite.id).subscribe({
      next: () => {
        this.busy.set(false);
        this.invites.update((invites) => invites.filter((existing) => existing.id !== invite.id));
        this.snackBar.open(`The invite for ${invite.email} is withdrawn.`, 'Dismiss', { duration: 6000 });
      },
      error: () => this.busy.set(false),
    });
  }

  protected changeRole(member: MemberDto, role: BuildRole): void {
    if (role === member.role) return;
    this.busy.set(true);
    this.crewApi.changeRole(this.buildId(), member.userId, { role }).subscribe({
      next: (updated) => {
        this.busy.set(false);
        this.members.update((members) => members.map((existing) => (existing.userId === updated.userId ? updated : existing)));
        this.snackBar.open(`${updated.displayName} is now ${ROLE_LABELS[updated.role]}.`, 'Dismiss', { duration: 6000 });
      },
      error: () => {
        this.busy.set(false);
        // Put the select back to what the server holds.
        this.load(this.buildId());
      },
    });
  }

  protected remove(member: MemberDto): void {
    confirmAction(this.dialog, {
      title: `Remove ${member.displayName}?`,
      message: 'They lose access to this build at once. What they recorded stays. You can invite them again later.',
      confirmLabel: 'Remove',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          return this.crewApi.removeMember(this.buildId(), member.userId);
        }),
      )
      .subscribe({
        next: () => {
          this.busy.set(false);
          this.members.update((members) => members.filter((existing) => existing.userId !== member.userId));
        },
        error: () => this.busy.set(false),
      });
  }

  protected leave(): void {
    const myUserId = this.myUserId();
    if (!myUserId) return;
    confirmAction(this.dialog, {
      title: 'Leave this build?',
      message: 'You lose access to it at once. What you recorded stays. The owner can invite you again.',
      confirmLabel: 'Leave build',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          return this.crewApi.removeMember(this.buildId(), myUserId);
        }),
      )
      .subscribe({
        next: () => {
          this.busy.set(false);
          this.snackBar.open('You left the build.', 'Dismiss', { duration: 6000 });
          void this.router.navigateByUrl('/builds');
        },
        error: () => this.busy.set(false),
      });
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.crewApi.members(buildId).subscribe({
      next: (response) => {
        this.members.set(response.members);
        this.invites.set(response.invites);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }
}
