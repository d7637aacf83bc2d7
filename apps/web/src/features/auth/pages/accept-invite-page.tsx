import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useParams } from 'react-router';
import { passwordSchema } from '@lotwise/shared';
import { KeyRound } from 'lucide-react';
import { z } from 'zod';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { AuthCard } from '../components/auth-card';
import { useAcceptInvite, useInvite } from '../api';

const choosePasswordSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((values) => values.password === values.confirm, {
    path: ['confirm'],
    message: 'does not match the password above',
  });
type ChoosePassword = z.infer<typeof choosePasswordSchema>;

export function AcceptInvitePage() {
  const { token = '' } = useParams();
  const invite = useInvite(token);
  const accept = useAcceptInvite();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ChoosePassword>({
    resolver: zodResolver(choosePasswordSchema),
    defaultValues: { password: '', confirm: '' },
  });

  if (invite.isPending) {
    return (
      <AuthCard title="Your invitation">
        <PageSpinner label="Checking the invitation…" />
      </AuthCard>
    );
  }

  if (invite.isError) {
    const gone =
      isApiError(invite.error) && (invite.error.status === 404 || invite.error.status === 409);
    return (
      <AuthCard title="Your invitation">
        <Notice
          tone="danger"
          title={gone ? 'This invitation cannot be used' : 'The invitation could not be checked'}
        >
          {gone
            ? 'The link is not valid, has expired or has been used already. Ask whoever runs Lotwise for your lab to send a new one.'
            : errorMessage(invite.error)}
        </Notice>
        <Link to={paths.signIn} className={`${buttonClasses('secondary')} mt-4 w-full`}>
          Go to sign-in
        </Link>
      </AuthCard>
    );
  }

  if (accept.isSuccess) {
    return (
      <AuthCard title="You are all set">
        <Notice tone="ok" title="Your password is saved">
          You can now use Lotwise with {invite.data.email ?? 'your e-mail address'} and the password
          you chose.
        </Notice>
        <Link to={paths.home} className={`${buttonClasses('primary')} mt-4 w-full`}>
          Continue to Lotwise
        </Link>
      </AuthCard>
    );
  }

  const greeting = invite.data.displayName
    ? `Welcome, ${invite.data.displayName}`
    : 'Welcome to Lotwise';

  const onSubmit = handleSubmit(({ password }) => {
    accept.mutate(
      { token, password },
      {
        onError: (error) => {
          if (isApiError(error) && error.fields.password)
            setError('password', { message: error.fields.password });
        },
      },
    );
  });

  return (
    <AuthCard
      title={greeting}
      intro={
        <>
          Choose a password to finish setting up
          {invite.data.email ? (
            <>
              {' '}
              <strong className="font-medium text-ink-800">{invite.data.email}</strong>
            </>
          ) : (
            ' your account'
          )}
          .
        </>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {accept.isError && !(isApiError(accept.error) && accept.error.fields.password) && (
          <Notice tone="danger" title="The password was not saved">
            {errorMessage(accept.error)}
          </Notice>
        )}
        <Field
          label="Password"
          hint="At least 10 characters."
          error={fieldMessage('Password', errors.password?.message)}
        >
          {(control) => (
            <Input
              {...control}
              type="password"
              autoComplete="new-password"
              autoFocus
              {...register('password')}
            />
          )}
        </Field>
        <Field
          label="Password again"
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
          busy={accept.isPending}
          icon={<KeyRound aria-hidden="true" className="size-4" />}
        >
          Save password
        </Button>
      </form>
    </AuthCard>
  );
}
