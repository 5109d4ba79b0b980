import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import type { AppConfig, Me } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError } from '../../../lib/api-client';
import { formatRole } from '../../../lib/format';
import { useSignIn } from '../api/session';

const signInSchema = z.object({
  email: z.string().trim().min(1, 'E-mail is required').pipe(z.email('Enter an e-mail address such as name@example.com')),
  password: z.string().min(1, 'Password is required'),
});
type SignInValues = z.infer<typeof signInSchema>;

interface SignInFormProps {
  config: AppConfig | undefined;
  onSignedIn: (me: Me | null) => void;
}

export function SignInForm({ config, onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setValue,
    formState: { errors },
  } = useForm<SignInValues>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }));
  const refused = isApiError(signIn.error) && signIn.error.code === 'invalid_credentials';
  const demoAccounts = config?.demoAccounts ?? [];

  return (
    <div className="flex flex-col gap-8">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Sign in">
        {signIn.isError ? (
          <Notice tone="error" title={refused ? 'Not signed in' : 'Sign-in failed'}>
            {describeError(signIn.error)}
          </Notice>
        ) : null}
        <TextField label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...register('email')} />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...register('password')}
        />
        <Button type="submit" busy={signIn.isPending} className="w-full py-2.5">
          Sign in
        </Button>
      </form>

      {demoAccounts.length > 0 ? (
        <section aria-labelledby="demo-accounts-title" className="rounded-plate border border-dashed border-ember-500/60 bg-ember-50 p-4">
          <h2 id="demo-accounts-title" className="text-small font-semibold text-ember-700">
            Demo accounts — an invented organisation
          </h2>
          <p className="mt-1 text-caption text-ink-soft">
            This server runs in {config?.mode} mode with invented demo data.
            {config?.demoPassword ? (
              <>
                {' '}
                Every demo account uses the password <code className="rounded bg-paper-raised px-1 font-semibold">{config.demoPassword}</code>.
              </>
            ) : null}{' '}
            Choose one to fill in the form.
          </p>
          <ul className="mt-3 grid gap-2">
            {demoAccounts.map((account) => (
              <li key={account.email}>
                <button
                  type="button"
                  className="flex w-full items-baseline justify-between gap-3 rounded-plate border border-paper-line bg-paper-raised px-3 py-2 text-left hover:border-tide-600 hover:bg-tide-50"
                  aria-label={`Use the demo ${formatRole(account.role).toLowerCase()} account ${account.email}`}
                  onClick={() => {
                    setValue('email', account.email, { shouldValidate: true });
                    if (config?.demoPassword) setValue('password', config.demoPassword, { shouldValidate: true });
                  }}
                >
                  <span className="text-small font-semibold text-ink">{formatRole(account.role)}</span>
                  <span className="truncate text-caption text-ink-soft">{account.email}</span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
