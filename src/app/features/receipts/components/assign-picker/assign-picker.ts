// One field assigns a receipt line: to a part of the bill of materials (its system comes with it, shown as text) or
// to a system only. The reader's suggestions come first, each with its reason.
import { ChangeDetectionStrategy, Component, computed, input, output, signal, viewChild } from '@angular/core';
import { MatAutocompleteModule, MatAutocompleteSelectedEvent, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { PartDto, SystemDto } from '../../../../../../shared/api/parts';
import type { ReceiptLineDto } from '../../../../../../shared/api/receipts';
import type { LineSuggestionDto } from '../../../../../../shared/api/suggestions';

/** Where a line goes: a part (with its system) or a system alone. */
export interface Assignment {
  partId: string | null;
  systemId: string;
}

/** Parts listed at most, so a long bill of materials stays quick to scroll on a phone. */
const MAX_PARTS = 30;

function normalised(text: string): string {
  return text.toLowerCase().replace(/[\s\-.]/g, '');
}

@Component({
  selector: 'th-assign-picker',
  imports: [MatAutocompleteModule, MatFormFieldModule, MatIconModule, MatInputModule],
  templateUrl: './assign-picker.html',
  styleUrl: './assign-picker.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssignPicker {
  readonly line = input.required<ReceiptLineDto>();
  readonly lineNumber = input.required<number>();
  readonly parts = input.required<readonly PartDto[]>();
  readonly systems = input.required<readonly SystemDto[]>();
  readonly suggestions = input<readonly LineSuggestionDto[]>([]);
  readonly disabled = input(false);
  /** Grid position for the check table's arrow keys. */
  readonly row = input<number | null>(null);
  readonly assign = output<Assignment>();

  protected readonly query = signal('');
  private readonly trigger = viewChild(MatAutocompleteTrigger);

  /** The list closes by itself on Tab, Escape or a click elsewhere; the check table closes it when arrows leave. */
  closePanel(): void {
    this.trigger()?.closePanel();
  }

  protected readonly activeSystems = computed(() => this.systems().filter((system) => !system.archived));

  protected readonly systemName = computed(() => {
    const systemId = this.line().systemId;
    return systemId ? (this.systems().find((system) => system.id === systemId)?.name ?? 'A system') : null;
  });

  /** What the field shows: the part, or the system when the line has no part. */
  protected readonly label = computed(() => this.line().partDescription ?? this.systemName() ?? '');

  protected readonly matchingParts = computed(() => {
    const query = this.query().trim().toLowerCase();
    const compact = normalised(query);
    const parts = this.parts();
    const matches = query
      ? parts.filter((part) => (compact && normalised(part.partNumber).includes(compact)) || part.description.toLowerCase().includes(query))
      : parts;
    return matches.slice(0, MAX_PARTS);
  });

  protected readonly matchingSystems = computed(() => {
    const query = this.query().trim().toLowerCase();
    return query ? this.activeSystems().filter((system) => system.name.toLowerCase().includes(query)) : this.activeSystems();
  });

  /** Suggestions only while nothing is typed: once the person searches, the search decides. */
  protected readonly shownSuggestions = computed(() => (this.query().trim() ? [] : this.suggestions().slice(0, 3)));

  protected readonly displayWith = (value: Assignment | null): string => {
    if (!value) return '';
    if (value.partId) return this.parts().find((part) => part.id === value.partId)?.description ?? '';
    return this.systems().find((system) => system.id === value.systemId)?.name ?? '';
  };

  protected partSystemName(part: PartDto): string {
    return this.systems().find((system) => system.id === part.systemId)?.name ?? '';
  }

  protected picked(event: MatAutocompleteSelectedEvent): void {
    this.query.set('');
    this.assign.emit(event.option.value as Assignment);
  }

  /**
   * The list closing without a pick (Escape, a click elsewhere, Tab) puts back what the line is assigned to. Done on
   * the list's close, not the field's blur: a pointer press on an option blurs the field first, and resetting the
   * filter then would redraw the options under the pointer and lose the click.
   */
  protected restore(input: HTMLInputElement): void {
    this.query.set('');
    input.value = this.label();
  }
}
