import { AbstractControl, FormGroup } from '@angular/forms';

const DEFAULT_MESSAGES: Record<string, (value: unknown) => string> = {
  required: () => 'This is required.',
  email: () => 'Enter a valid e-mail address.',
  maxlength: (v) => `Use at most ${(v as { requiredLength: number }).requiredLength} characters.`,
  minlength: (v) => `Use at least ${(v as { requiredLength: number }).requiredLength} characters.`,
  min: (v) => `Use ${(v as { min: number }).min} or more.`,
  max: (v) => `Use ${(v as { max: number }).max} or less.`,
};

/**
 * The message to show under a field. Validators of ours put their message in the error value;
 * `server` holds what the API said about the field; `overrides` rename built-in messages per field.
 */
export function fieldError(control: AbstractControl | null, overrides: Record<string, string> = {}): string {
  const errors = control?.errors;
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return errors['server'];
  for (const [key, value] of Object.entries(errors)) {
    if (overrides[key]) return overrides[key];
    if (typeof value === 'string') return value;
    const fallback = DEFAULT_MESSAGES[key];
    if (fallback) return fallback(value);
  }
  return 'Check this field.';
}

/**
 * Puts the API's 422 `fields` on the matching controls (the server's field names may differ from
 * ours: `aliases` maps server name → control name). Returns the messages no control could show.
 */
export function applyServerErrors(
  form: FormGroup,
  fields: Record<string, string>,
  aliases: Record<string, string> = {},
): string[] {
  const leftOver: string[] = [];
  for (const [field, message] of Object.entries(fields)) {
    const control = form.get(aliases[field] ?? field);
    if (control) {
      control.setErrors({ ...(control.errors ?? {}), server: message });
      control.markAsTouched();
    } else {
      leftOver.push(message);
    }
  }
  return leftOver;
}
