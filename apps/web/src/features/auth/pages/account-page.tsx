import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { passwordSchema } from '@lotwise/shared';
import { KeyRound } from 'lucide-react';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useChangePassword } from '../api';

const changePasswordFormSchema = z
  .object({
    currentPassword: z.string().min(1, 'is required'),
    newPassword: passwordSchema,
    confirm: z.string(),
  })
  .refine((values) => values.newPassword === values.confirm, {
    path: ['confirm'],
    message: 'does not match the new password',
  });
type ChangePasswordForm = z.infer<typeof changePasswordFormSchema>;

/** The signed-in person's own account: a new password signs them out everywhere else. */
export function AccountPage() {
  const change = useChangePassword();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<ChangePasswordForm>({
    resolver: zodResolver(changePasswordFormSchema),
    defaultValues: { currentPassword: '', newPassword: '', confirm: '' },
  });

  const onSubmit = handleSubmit(({ currentPassword, newPassword }) => {
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => reset(),
        onError: (error) => {
          if (!isApiError(error)) return;
          if (error.fields.currentPassword)
            setError('currentPassword', { message: error.fields.currentPassword });
          if (error.fields.newPassword)
            setError('newPassword', { message: error.fields.newPassword });
        },
      },
    );
  });
  const fieldError = isApiError(change.error) && Object.keys(change.error.fields).length > 0;

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-md flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold text-ink-900">Your password</h1>
        <p className="text-sm text-ink-600">
          Saving a new password signs you out on every other computer and phone; this browser stays
          signed in.
        </p>
      </div>
      {change.isSuccess && (
        <Notice tone="ok" title="Your new password is saved">
          Any other place you were signed in has been signed out.
        </Notice>
      )}
      {change.isError && !fieldError && (
        <Notice tone="danger" title="The password was not changed">
          {errorMessage(change.error)}
        </Notice>
      )}
      <Field
        label="Current password"
        error={fieldMessage('The current password', errors.currentPassword?.message)}
      >
        {(control) => (
          <Input
            {...control}
            type="password"
            autoComplete="current-password"
            {...register('currentPassword')}
          />
        )}
      </Field>
      <Field
        label="New password"
        hint="At least 10 characters."
        error={fieldMessage('The new password', errors.newPassword?.message)}
      >
        {(control) => (
          <Input
            {...control}
            type="password"
            autoComplete="new-password"
            {...register('newPassword')}
          />
        )}
      </Field>
      <Field
        label="New password again"
        error={fieldMessage('The repeated password', errors.confirm?.message)}
      >
        {(control) => (
          <Input
            {...control}
            type="password"
            autoComplete="new-password"
            {...register('confirm')}
          />
        )}
      </Field>
      <Button
        type="submit"
        variant="primary"
        busy={change.isPending}
        icon={<KeyRound aria-hidden="true" className="size-4" />}
      >
        Save new password
      </Button>
    </form>
  );
}
