// /builds/:buildId/alerts: which mail alerts this person gets about this build, one switch per kind, saved at once.
import { ChangeDetectionStrategy, Component, effect, inject, input, signal, untracked } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleChange, MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ALERT_KINDS, ALERT_LABELS, AlertKind, AlertPreferences } from '../../../../../shared/api/alerts';
import { AlertsApi } from '../services/alerts-api';

@Component({
  selector: 'th-alert-settings',
  imports: [MatProgressBarModule, MatSlideToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './alert-settings.html',
  styleUrl: './alert-settings.css',
})
export class AlertSettings {
  private readonly alertsApi = inject(AlertsApi);
  private readonly snackBar = inject(MatSnackBar);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly kinds = ALERT_KINDS;
  protected readonly labels = ALERT_LABELS;
  protected readonly preferences = signal<AlertPreferences | null>(null);
  protected readonly chosen = signal(false);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly saving = signal(false);

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected toggle(kind: AlertKind, change: MatSlideToggleChange): void {
    const on = change.checked;
    const before = this.preferences();
    if (!before) return;
    const next = { ...before, [kind]: on };
    this.preferences.set(next);
    this.saving.set(true);
    this.alertsApi.save(this.buildId(), next).subscribe({
      next: (saved) => {
        const { chosen, ...preferences } = saved;
        this.preferences.set(preferences);
        this.chosen.set(chosen);
        this.saving.set(false);
        this.snackBar.open(`${ALERT_LABELS[kind].label}: ${on ? 'you will get these mails' : 'no more mails of this kind'}.`, 'Dismiss', { duration: 5000 });
      },
      // The error itself is shown by the API error interceptor; the switch goes back to what is saved.
      error: () => {
        this.preferences.set(before);
        // Set on the switch itself too: the binding may not have seen the flipped value, so it would not move back.
        change.source.checked = before[kind];
        this.saving.set(false);
      },
    });
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.alertsApi.preferences(buildId).subscribe({
      next: ({ chosen, ...preferences }) => {
        this.preferences.set(preferences);
        this.chosen.set(chosen);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }
}
