// /builds/new and /builds/:buildId/edit: a build's name, vehicle, currency, region, status and dates.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { DateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { Moment } from 'moment';
import { BuildDto, createBuildRequest, updateBuildRequest } from '../../../../../shared/api/builds';
import { BUILD_STATUSES, BUILD_STATUS_LABELS, BuildStatus } from '../../../../../shared/enums';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { currencyName, filterCurrencies } from '../models/currencies';
import { filterLocales, localeName, localeOptions } from '../models/locales';
import { BuildsApi } from '../services/builds-api';
import { CurrentBuild } from '../services/current-build';

@Component({
  selector: 'th-build-form',
  imports: [
    ReactiveFormsModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    RouterLink,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './build-form.html',
  styleUrl: './build-form.css',
})
export class BuildForm {
  private readonly buildsApi = inject(BuildsApi);
  private readonly router = inject(Router);
  private readonly dateAdapter = inject<DateAdapter<Moment>>(DateAdapter);
  /** Present when the form sits in a build's shell (editing). */
  private readonly currentBuild = inject(CurrentBuild, { optional: true });

  /** Route parameter, bound by the router; absent when creating. */
  readonly buildId = input<string>();

  protected readonly errorOf = errorOf;
  protected readonly statuses = BUILD_STATUSES;
  protected readonly statusLabels = BUILD_STATUS_LABELS;
  protected readonly editing = computed(() => !!this.buildId());
  protected readonly loading = signal(false);
  protected readonly saving = signal(false);
  protected readonly conflict = signal(false);
  private version = 0;

  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly form = this.formBuilder.group({
    name: '',
    vehicle: '',
    currency: 'USD',
    locale: 'en-US',
    status: this.formBuilder.control<BuildStatus>('planning'),
    startedOn: this.formBuilder.control<Moment | null>(null),
    targetDate: this.formBuilder.control<Moment | null>(null),
    // Days after purchase an unfitted part can go back: 30 is common practice, from memory.
    returnWindowDays: this.formBuilder.control<number | null>(30),
  });

  private readonly currencyTyped = toSignal(this.form.controls.currency.valueChanges, { initialValue: 'USD' });
  protected readonly currencyOptions = computed(() => {
    const typed = (this.currencyTyped() ?? '').trim();
    // Once a whole code is in the field, offer the full list again rather than that one match.
    return filterCurrencies(currencyName(typed.toUpperCase()) !== typed.toUpperCase() ? '' : typed);
  });
  protected readonly currencyHint = computed(() => {
    const code = (this.currencyTyped() ?? '').trim().toUpperCase();
    const name = currencyName(code);
    return name !== code ? name : 'ISO 4217 code, such as USD or EUR';
  });

  /** The person's own browser languages first. */
  private readonly locales = localeOptions(typeof navigator === 'undefined' ? [] : navigator.languages);
  private readonly localeTyped = toSignal(this.form.controls.locale.valueChanges, { initialValue: 'en-US' });
  protected readonly localeChoices = computed(() => {
    const typed = (this.localeTyped() ?? '').trim();
    // A whole known tag in the field offers the full list again, as the currency does.
    return filterLocales(this.locales, this.locales.some((option) => option.tag === typed) ? '' : typed);
  });
  protected readonly localeHint = computed(() => {
    const typed = (this.localeTyped() ?? '').trim();
    const name = typed ? localeName(typed) : typed;
    return name && name !== typed ? `${name}: dates and amounts are shown this way` : 'For dates and amounts, such as en-US or en-GB';
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      if (buildId) untracked(() => this.load(buildId));
    });
  }

  protected submit(): void {
    if (this.saving()) return;
    const raw = this.form.getRawValue();
    const dates = { startedOn: this.toIsoDate(raw.startedOn), targetDate: this.toIsoDate(raw.targetDate) };
    const buildId = this.buildId();

    if (buildId) {
      const request = validateWith(this.form, updateBuildRequest, {
        name: raw.name,
        vehicle: raw.vehicle,
        locale: raw.locale,
        status: raw.status,
        ...dates,
        returnWindowDays: raw.returnWindowDays,
        version: this.version,
      });
      if (!request) return;
      this.save(this.buildsApi.update(buildId, request));
    } else {
      const request = validateWith(this.form, createBuildRequest, {
        name: raw.name,
        vehicle: raw.vehicle,
        currency: raw.currency,
        locale: raw.locale,
        status: raw.status,
        ...dates,
      });
      if (!request) return;
      this.save(this.buildsApi.create(request));
    }
  }

  private save(request: ReturnType<BuildsApi['create']>): void {
    this.saving.set(true);
    this.conflict.set(false);
    request.subscribe({
      next: (build) => {
        this.saving.set(false);
        this.currentBuild?.set(build);
        void this.router.navigate(['/builds', build.id]);
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        this.saving.set(false);
        if (apiError.status === 409 && this.buildId()) {
          this.conflict.set(true);
          this.load(this.buildId()!);
          return;
        }
        applyFieldErrors(this.form, apiError.fields);
      },
    });
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.buildsApi.get(buildId).subscribe({
      next: (build) => {
        this.fill(build);
        this.currentBuild?.set(build);
        this.loading.set(false);
      },
      error: () => this.loading.set(false),
    });
  }

  private fill(build: BuildDto): void {
    this.version = build.version;
    this.form.reset({
      name: build.name,
      vehicle: build.vehicle,
      currency: build.currency,
      locale: build.locale,
      status: build.status,
      startedOn: build.startedOn ? this.dateAdapter.deserialize(build.startedOn) : null,
      targetDate: build.targetDate ? this.dateAdapter.deserialize(build.targetDate) : null,
      returnWindowDays: build.returnWindowDays,
    });
    // The currency is fixed at creation: every amount of the build is in it.
    this.form.controls.currency.disable();
  }

  /** Calendar dates travel as YYYY-MM-DD, in the person's own calendar (no time zone shift). */
  private toIsoDate(value: Moment | null): string | null {
    if (!value || !this.dateAdapter.isValid(value)) return null;
    return value.format('YYYY-MM-DD');
  }
}
