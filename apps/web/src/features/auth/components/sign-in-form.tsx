import { useForm } from 'react-hook-form';
import {
  emailAddressMessage,
  isEmailAddress,
  normalizeEmail,
  type LoginBody,
} from '@lotwise/shared';
import { LogIn } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { useSignIn } from '../api';

function signInProblem(error: unknown): { title: string; detail?: string } | null {
  if (!error) return null;
  if (isApiError(error)) {
    if (error.code === 'rate_limited') {
      return {
        title: 'Too many sign-in attempts',
        detail: `${error.message} Wait a few minutes before trying again.`,
      };
    }
    if (error.status === 401) return { title: 'Could not sign in', detail: error.message };
    if (error.code === 'validation_failed') return null;
    return { title: 'Could not sign in', detail: error.message };
  }
  return { title: 'Could not sign in', detail: 'Something went wrong. Try again.' };
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<LoginBody>({ defaultValues: { email: '', password: '' } });

  // The contract's rules for a sign-in (loginBodySchema) without zod: this is the first page.
  const onSubmit = handleSubmit((values) => {
    signIn.mutate(
      { email: normalizeEmail(values.email), password: values.password },
      {
        onSuccess: onSignedIn,
        onError: (error) => {
          if (isApiError(error)) {
            for (const [field, message] of Object.entries(error.fields)) {
              if (field === 'email' || field === 'password') setError(field, { message });
            }
          }
        },
      },
    );
  });

  const problem = signInProblem(signIn.error);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="danger" title={problem.title}>
          {problem.detail}
        </Notice>
      )}
      <Field label="E-mail" error={fieldMessage('E-mail', errors.email?.message)}>
        {(control) => (
          <Input
            {...control}
            type="email"
            autoComplete="username"
            autoFocus
            {...register('email', {
              validate: (value) =>
                isEmailAddress(normalizeEmail(value)) ? true : emailAddressMessage,
            })}
          />
        )}
      </Field>
      <Field label="Password" error={fieldMessage('Password', errors.password?.message)}>
        {(control) => (
          <Input
            {...control}
            type="password"
            autoComplete="current-password"
            {...register('password', { required: 'is required' })}
          />
        )}
      </Field>
      <Button
        type="submit"
        variant="primary"
        busy={signIn.isPending}
        icon={<LogIn aria-hidden="true" className="size-4" />}
      >
        Sign in
      </Button>
    </form>
  );
}
