import type { ValidationErrors } from '@angular/forms';

/** One sentence for a control's errors: our own validators carry `message`, Angular's get words here. */
export function errorText(errors: ValidationErrors | null | undefined): string {
  if (!errors) return '';
  if (errors['required']) return 'Required.';
  if (errors['maxlength']) return `At most ${(errors['maxlength'] as { requiredLength: number }).requiredLength} characters.`;
  if (errors['min']) return `At least ${(errors['min'] as { min: number }).min}.`;
  if (errors['max']) return `At most ${(errors['max'] as { max: number }).max}.`;
  for (const e of Object.values(errors)) {
    if (e && typeof e === 'object' && typeof (e as { message?: unknown }).message === 'string') return (e as { message: string }).message;
  }
  return 'Not valid.';
}
