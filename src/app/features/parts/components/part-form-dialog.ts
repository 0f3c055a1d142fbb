// The add / edit part dialog: the shared schema's checks and the server's on the fields, and a stale edit shown field by field.
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { filter, switchMap } from 'rxjs';
import { PartDto, SystemDto, createPartRequest, updatePartRequest } from '../../../../../shared/api/parts';
import { PART_STATUSES, PART_STATUS_LABELS, PartStatus } from '../../../../../shared/enums';
import { minorUnits, multiply, parseMoney, roundToMinor, tooManyDecimalsMessage } from '../../../../../shared/money';
import { UNITS, UNIT_LABELS, Unit } from '../../../../../shared/units';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { confirmAction } from '../../../ui/confirm-dialog';
import { moneyText } from '../../../ui/money';
import { PartsApi } from '../services/parts-api';

export interface PartFormData {
  buildId: string;
  currency: string;
  locale: string;
  /** Systems a part may be put in (the active ones, plus the part's own). */
  systems: SystemDto[];
  /** The part to edit; absent when adding. */
  part?: PartDto;
  /** The system to preselect when adding. */
  systemId?: string;
}

export type PartFormResult = { saved: PartDto } | { deleted: string };

type FieldName =
  | 'systemId'
  | 'description'
  | 'partNumber'
  | 'quantity'
  | 'unit'
  | 'estimatedUnitCost'
  | 'status'
  | 'storageLocation'
  | 'sourceUrl'
  | 'notes'
  | 'forSale'
  | 'askingPrice';

const FIELD_LABELS: Record<FieldName, string> = {
  systemId: 'System',
  description: 'Description',
  partNumber: 'Part number',
  quantity: 'Quantity',
  unit: 'Unit',
  estimatedUnitCost: 'Estimated unit cost',
  status: 'Status',
  storageLocation: 'Storage location',
  sourceUrl: 'Source link',
  notes: 'Notes',
  forSale: 'For sale',
  askingPrice: 'Asking price',
};

const AMOUNT_FIELDS: readonly FieldName[] = ['quantity', 'estimatedUnitCost', 'askingPrice'];

/** A part's editable fields as the form holds them (all text, booleans as they are). */
interface PartFields {
  systemId: string;
  description: string;
  partNumber: string;
  quantity: string;
  unit: Unit;
  estimatedUnitCost: string;
  status: PartStatus;
  storageLocation: string;
  sourceUrl: string;
  notes: string;
  forSale: boolean;
  askingPrice: string;
}

export interface FieldDifference {
  field: FieldName;
  label: string;
  yours: string;
  saved: string;
}

function fieldsOf(part: PartDto): PartFields {
  return {
    systemId: part.systemId,
    description: part.description,
    partNumber: part.partNumber,
    quantity: part.quantity,
    unit: part.unit,
    estimatedUnitCost: part.estimatedUnitCost,
    status: part.status,
    storageLocation: part.storageLocation,
    sourceUrl: part.sourceUrl,
    notes: part.notes,
    forSale: part.forSale,
    askingPrice: part.askingPrice ?? '',
  };
}

/** Same value, where amounts compare as numbers ("24.9" equals "24.90") and text as typed, ignoring outer spaces. */
function sameValue(field: FieldName, left: string | boolean, right: string | boolean): boolean {
  if (typeof left === 'boolean' || typeof right === 'boolean') return left === right;
  if (AMOUNT_FIELDS.includes(field)) {
    const a = parseMoney(left);
    const b = parseMoney(right);
    if (a.ok && b.ok) return a.value.equals(b.value);
  }
  return left.trim() === right.trim();
}

@Component({
  selector: 'th-part-form-dialog',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './part-form-dialog.html',
  styleUrl: './part-form-dialog.css',
})
export class PartFormDialog {
  protected readonly data = inject<PartFormData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<PartFormDialog, PartFormResult>>(MatDialogRef);
  private readonly dialog = inject(MatDialog);
  private readonly partsApi = inject(PartsApi);

  protected readonly errorOf = errorOf;
  protected readonly units = UNITS;
  protected readonly unitLabels = UNIT_LABELS;
  protected readonly statuses = PART_STATUSES;
  protected readonly statusLabels = PART_STATUS_LABELS;

  protected readonly saving = signal(false);
  protected readonly problem = signal('');
  /** The part as saved by someone else, after a stale edit. */
  protected readonly conflict = signal<PartDto | null>(null);
  private version = this.data.part?.version ?? 0;

  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly form = this.formBuilder.group({
    systemId: this.data.systemId ?? this.data.systems[0]?.id ?? '',
    description: '',
    partNumber: '',
    quantity: '1',
    unit: this.formBuilder.control<Unit>('each'),
    estimatedUnitCost: '',
    status: this.formBuilder.control<PartStatus>('planned'),
    storageLocation: '',
    sourceUrl: '',
    notes: '',
    forSale: false,
    askingPrice: '',
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly forSale = computed(() => this.values().forSale === true);
  /** Quantity × unit cost as the server will round it, or '' while either is not a valid amount. */
  protected readonly estimatedTotal = computed(() => {
    const quantity = parseMoney(this.values().quantity ?? '');
    const cost = parseMoney(this.values().estimatedUnitCost ?? '');
    if (!quantity.ok || !cost.ok) return '';
    return moneyText(roundToMinor(multiply(cost.value, quantity.value), this.data.currency), this.data.currency, this.data.locale);
  });
  protected readonly differences = computed<FieldDifference[]>(() => {
    const saved = this.conflict();
    if (!saved) return [];
    this.values();
    const mine = this.form.getRawValue();
    const theirs = fieldsOf(saved);
    return (Object.keys(FIELD_LABELS) as FieldName[])
      .filter((field) => !sameValue(field, mine[field], theirs[field]))
      .map((field) => ({ field, label: FIELD_LABELS[field], yours: this.display(field, mine[field]), saved: this.display(field, theirs[field]) }));
  });

  constructor() {
    if (this.data.part) this.form.reset(fieldsOf(this.data.part));
  }

  protected submit(): void {
    if (this.saving()) return;
    this.problem.set('');
    const raw = this.form.getRawValue();
    const request = {
      ...raw,
      description: raw.description.trim(),
      partNumber: raw.partNumber.trim(),
      quantity: raw.quantity.trim(),
      estimatedUnitCost: raw.estimatedUnitCost.trim(),
      storageLocation: raw.storageLocation.trim(),
      sourceUrl: raw.sourceUrl.trim(),
      notes: raw.notes.trim(),
      askingPrice: raw.forSale && raw.askingPrice.trim() !== '' ? raw.askingPrice.trim() : null,
    };
    const partId = this.data.part?.id;
    const valid = partId
      ? validateWith(this.form, updatePartRequest, { ...request, version: this.version })
      : validateWith(this.form, createPartRequest, request);
    if (!valid || !this.askingPriceFits(request.askingPrice)) return;

    this.saving.set(true);
    // The raw strings go to the API: the schema's output holds Decimals, which are for computing, not sending.
    const call = partId
      ? this.partsApi.update(this.data.buildId, partId, { ...request, version: this.version })
      : this.partsApi.create(this.data.buildId, request);
    call.subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.dialogRef.close({ saved });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const apiError = toApiError(error);
        if (apiError.status === 409 && isPart(apiError.current)) {
          this.conflict.set(apiError.current);
          return;
        }
        const unmatched = applyFieldErrors(this.form, apiError.fields);
        if (unmatched.length) this.problem.set(unmatched.join(' '));
        else if (apiError.status === 409) this.problem.set(apiError.message);
      },
    });
  }

  /** Keep mine: send the form again over the version just saved by the other person. */
  protected keepMine(): void {
    const saved = this.conflict();
    if (!saved) return;
    this.version = saved.version;
    this.conflict.set(null);
    this.submit();
  }

  protected takeSaved(saved: PartDto): void {
    this.dialogRef.close({ saved });
  }

  protected remove(): void {
    const part = this.data.part;
    if (!part) return;
    confirmAction(this.dialog, {
      title: `Delete "${part.description}"?`,
      message: 'It leaves the bill of materials and its estimate leaves the totals. This cannot be undone.',
      confirmLabel: 'Delete part',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.saving.set(true);
          return this.partsApi.remove(this.data.buildId, part.id);
        }),
      )
      .subscribe({
        next: () => {
          this.saving.set(false);
          this.dialogRef.close({ deleted: part.id });
        },
        error: () => this.saving.set(false),
      });
  }

  /** The asking price is money a person pays, so it must fit the currency's minor units (the server checks it too). */
  private askingPriceFits(askingPrice: string | null): boolean {
    if (askingPrice === null) return true;
    const places = minorUnits(this.data.currency);
    const parsed = parseMoney(askingPrice, { maxDecimals: places });
    if (parsed.ok) return true;
    this.form.controls.askingPrice.setErrors({ message: parsed.message.startsWith('Too many') ? tooManyDecimalsMessage(places) : parsed.message });
    this.form.controls.askingPrice.markAsTouched();
    return false;
  }

  private display(field: FieldName, value: string | boolean): string {
    if (typeof value === 'boolean') return value ? 'Yes' : 'No';
    if (field === 'systemId') return this.data.systems.find((system) => system.id === value)?.name ?? 'Another system';
    if (field === 'status') return PART_STATUS_LABELS[value as PartStatus] ?? value;
    if (field === 'unit') return UNIT_LABELS[value as Unit] ?? value;
    if (field === 'estimatedUnitCost' || field === 'askingPrice') {
      return moneyText(value, this.data.currency, this.data.locale, field === 'estimatedUnitCost' ? 4 : undefined) || value;
    }
    return value;
  }
}

function isPart(value: unknown): value is PartDto {
  return !!value && typeof value === 'object' && typeof (value as PartDto).id === 'string' && typeof (value as PartDto).version === 'number';
}
