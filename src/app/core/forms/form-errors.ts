// One way to validate a form: run the shared zod schema, and put its messages (or the server's) on the controls.
import { AbstractControl, FormGroup } from '@angular/forms';
import type { ZodType } from 'zod';

/** Puts each message on the control of the same name; answers the messages that matched no control. */
export function applyFieldErrors(form: FormGroup, fields: Readonly<Record<string, string>>): string[] {
  const unmatched: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const control = form.get(path);
    if (control) {
      control.setErrors({ message });
      control.markAsTouched();
    } else {
      unmatched.push(message);
    }
  }
  return unmatched;
}

/**
 * Checks a request against its schema. On success answers the parsed value; on failure puts the first
 * message for each field on its control and answers null. Controls are named like the request's fields.
 */
export function validateWith<T>(form: FormGroup, schema: ZodType<T>, request: unknown): T | null {
  // Start from the controls' own checks, so a message from the last attempt does not linger.
  for (const control of Object.values(form.controls)) control.updateValueAndValidity({ emitEvent: false });
  form.updateValueAndValidity({ emitEvent: false });
  const result = schema.safeParse(request);
  if (result.success) {
    // A Material control's own check (a date that does not parse) still blocks sending.
    if (!form.invalid) return result.data;
    form.markAllAsTouched();
    return null;
  }
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const path = issue.path.map(String).join('.');
    fields[path] ??= issue.message;
  }
  applyFieldErrors(form, fields);
  form.markAllAsTouched();
  return null;
}

/** The message to show under a field, from the schema, the server or a Material control's own check. */
export function errorOf(control: AbstractControl): string {
  const errors = control.errors;
  if (!errors) return '';
  if (typeof errors['message'] === 'string') return errors['message'];
  if (errors['matDatepickerParse']) return 'Enter a date like 3/14/2026, or pick one from the calendar.';
  if (errors['matDatepickerMin'] || errors['matDatepickerMax']) return 'That date is out of range.';
  return 'Check this field.';
}
