import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { passwordProblem } from '@shared/passwords';

/** The shared password policy as a form validator; the error value is the policy's own message. */
export const passwordPolicyValidator: ValidatorFn = (control: AbstractControl): ValidationErrors | null => {
  const value = String(control.value ?? '');
  if (value === '') return null; // `required` speaks for an empty field.
  const problem = passwordProblem(value);
  return problem ? { passwordPolicy: problem } : null;
};
