import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import {
  passwordSchema,
  roleDescriptions,
  roleLabels,
  roles,
  userCreateSchema,
  type UserCreated,
} from '@lotwise/shared';
import { UserPlus } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { useCreateUser } from '../api';
import { InviteLink } from './invite-link';

/** The shared create schema, plus the choice between a password now and an invitation link. */
const createUserFormSchema = userCreateSchema
  .omit({ password: true })
  .extend({ method: z.enum(['invite', 'password']), password: z.string() })
  .superRefine((values, ctx) => {
    if (values.method !== 'password') return;
    const check = passwordSchema.safeParse(values.password);
    if (!check.success) {
      ctx.addIssue({
        code: 'custom',
        path: ['password'],
        message: check.error.issues[0]?.message ?? 'is not valid',
      });
    }
  });
type CreateUserForm = z.input<typeof createUserFormSchema>;

const blank: CreateUserForm = {
  email: '',
  displayName: '',
  role: 'member',
  method: 'invite',
  password: '',
};

export function CreateUserDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const create = useCreateUser();
  const [created, setCreated] = useState<UserCreated | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<CreateUserForm, unknown, z.output<typeof createUserFormSchema>>({
    resolver: zodResolver(createUserFormSchema),
    defaultValues: blank,
  });
  const [method, role] = useWatch({ control, name: ['method', 'role'] });

  function handleClose() {
    setCreated(null);
    create.reset();
    reset(blank);
    onClose();
  }

  const submit = handleSubmit(async ({ method: chosen, password, ...rest }) => {
    try {
      const result = await create.mutateAsync({
        ...rest,
        password: chosen === 'password' ? password : undefined,
      });
      setCreated(result);
    } catch (error) {
      if (!isApiError(error)) return;
      for (const [path, message] of Object.entries(error.fields)) {
        const name = path.split('.')[0];
        if (name === 'email' || name === 'displayName' || name === 'role' || name === 'password') {
          setError(name, { type: 'server', message });
        }
      }
      if (error.code === 'conflict' && !error.fields.email)
        setError('email', { type: 'server', message: error.message });
    }
  });

  if (created) {
    return (
      <Dialog
        open={open}
        onClose={handleClose}
        title={`${created.user.displayName} can now use Lotwise`}
        footer={
          <Button variant="primary" onClick={handleClose}>
            Done
          </Button>
        }
      >
        {created.inviteUrl ? (
          <InviteLink url={created.inviteUrl} name={created.user.displayName} />
        ) : (
          <p className="text-sm text-ink-800">
            They sign in as <strong className="font-medium">{created.user.email}</strong> with the
            password you set. Pass it on privately.
          </p>
        )}
      </Dialog>
    );
  }

  const serverProblem =
    create.isError &&
    !(
      isApiError(create.error) &&
      (Object.keys(create.error.fields).length > 0 || create.error.code === 'conflict')
    )
      ? create.error
      : null;

  return (
    <Dialog
      open={open}
      onClose={handleClose}
      title="Add a person"
      description="They get a role now; you can change it later."
      footer={
        <>
          <Button onClick={handleClose}>Cancel</Button>
          <Button
            type="submit"
            form="create-user-form"
            variant="primary"
            busy={create.isPending}
            icon={<UserPlus aria-hidden="true" className="size-4" />}
          >
            {method === 'invite' ? 'Add and make link' : 'Add person'}
          </Button>
        </>
      }
    >
      <form id="create-user-form" onSubmit={submit} noValidate className="flex flex-col gap-4">
        {serverProblem && (
          <Notice tone="danger" title="Not added">
            {serverProblem.message}
          </Notice>
        )}
        <Field label="Name" error={fieldMessage('Name', errors.displayName?.message)}>
          {(c) => <Input {...c} autoComplete="off" {...register('displayName')} />}
        </Field>
        <Field label="E-mail" error={fieldMessage('E-mail', errors.email?.message)}>
          {(c) => <Input {...c} type="email" autoComplete="off" {...register('email')} />}
        </Field>
        <Field
          label="Role"
          error={fieldMessage('Role', errors.role?.message)}
          hint={roleDescriptions[role]}
        >
          {(c) => (
            <Select {...c} {...register('role')}>
              {roles.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-medium text-ink-800">How they get in</legend>
          <label className="flex items-start gap-2 text-sm">
            <input
              type="radio"
              value="invite"
              className="mt-1 accent-accent-600"
              {...register('method')}
            />
            <span>
              Make an invitation link
              <span className="block text-ink-600">
                They choose their own password. You copy the link and send it.
              </span>
            </span>
          </label>
          <label className="flex items-start gap-2 text-sm">
            <input
              type="radio"
              value="password"
              className="mt-1 accent-accent-600"
              {...register('method')}
            />
            <span>
              Set a password now
              <span className="block text-ink-600">For accounts you hand over in person.</span>
            </span>
          </label>
        </fieldset>
        {method === 'password' && (
          <Field
            label="Password"
            hint="At least 10 characters."
            error={fieldMessage('Password', errors.password?.message)}
          >
            {(c) => (
              <Input {...c} type="password" autoComplete="new-password" {...register('password')} />
            )}
          </Field>
        )}
      </form>
    </Dialog>
  );
}
