import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

import { newPasswordProblem } from '../../../shared/api/auth';

/**
 * The password rule of the server (length, not only spaces) as a form validator: the error
 * `newPassword` holds the message to show under the field.
 */
export const newPasswordValidator: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null => {
  const problem = newPasswordProblem(control.value ?? '');
  return problem ? { newPassword: problem } : null;
};
