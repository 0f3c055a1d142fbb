// /builds/:buildId/settings: what is set once and seldom changed, in one place, so the side rail holds the daily work:
// the build's details (the owner edits them), its inbox for mailed receipts, who works on it, and the person's own mail
// alerts.
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { BUILD_STATUS_LABELS } from '../../../../../../shared/enums';
import { currencyName } from '../../../builds/models/currencies';
import { localeName } from '../../../builds/models/locales';
import { CurrentBuild } from '../../../builds/services/current-build';
import { BuildInbox } from '../../components/build-inbox/build-inbox';

@Component({
  selector: 'th-settings-page',
  imports: [BuildInbox, MatIconModule, RouterLink],
  templateUrl: './settings-page.html',
  styleUrl: './settings-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  protected readonly current = inject(CurrentBuild);
  /** Route parameter (inherited from the build), bound by the router; the shell has loaded the build. */
  readonly buildId = input.required<string>();
  protected readonly build = computed(() => this.current.build());
  protected readonly isOwner = computed(() => this.build()?.role === 'owner');
  protected readonly statusLabels = BUILD_STATUS_LABELS;
  protected readonly currencyName = currencyName;
  protected readonly localeName = localeName;
}
