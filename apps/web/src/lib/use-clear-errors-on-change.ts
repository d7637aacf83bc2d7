import { useEffect } from 'react';
import type { FieldValues, UseFormReturn } from 'react-hook-form';

/**
 * The one rule for a form's errors once the person types again: a field's error and the
 * form's message from the server (`root.server`) describe the values that were sent, so they
 * go as soon as a value changes, and the next submit says what is wrong with the new ones.
 */
export function useClearErrorsOnChange<T extends FieldValues>(
  form: Pick<UseFormReturn<T>, 'watch' | 'clearErrors'>,
) {
  const { watch, clearErrors } = form;
  useEffect(() => {
    const subscription = watch((_values, { name, type }) => {
      // Only what the person changed: a reset or setValue after a save keeps its message.
      if (type !== 'change') return;
      clearErrors('root.server');
      if (name) clearErrors(name);
    });
    return () => subscription.unsubscribe();
  }, [watch, clearErrors]);
}
