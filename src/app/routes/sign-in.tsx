import { useState, type FormEvent } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { useSession, useSignIn } from '../../features/auth/api/session';
import { ApiError } from '../../lib/api-client';
import { Logo } from '../../components/ui/logo';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { Caution } from '../../components/ui/caution';

function safeNext(next: string | null): string {
  // Only paths inside the app: never an absolute URL an attacker could plant.
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export function Component() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const session = useSession();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const next = safeNext(params.get('next'));

  if (session.data) return <Navigate to={next} replace />;

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    signIn.mutate({ email, password }, { onSuccess: () => navigate(next, { replace: true }) });
  };

  const error = signIn.error instanceof ApiError ? signIn.error : null;
  const fieldError = (path: string) => error?.fieldErrors.find((detail) => detail.path === path)?.message;

  return (
    <main className="flex min-h-screen items-center justify-center bg-ink px-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <div className="mb-6 flex items-center gap-3">
          <Logo className="h-10 w-10" />
          <div>
            <p className="text-2xl font-bold text-ink">Whorl</p>
            <p className="text-sm text-ink-soft">Eddy current techniques, audits and corrective actions</p>
          </div>
        </div>
        <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
          <TextField
            label="E-mail address"
            type="email"
            autoComplete="username"
            required
            autoFocus
            value={email}
            onChange={(event) => setEmail(event.target.value)}
            error={fieldError('email')}
          />
          <TextField
            label="Password"
            type="password"
            autoComplete="current-password"
            required
            value={password}
            onChange={(event) => setPassword(event.target.value)}
            error={fieldError('password')}
          />
          {error && error.fieldErrors.length === 0 && (
            <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm font-bold text-fail">
              {error.message}
            </p>
          )}
          {signIn.error && !error && (
            <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm font-bold text-fail">
              {(signIn.error as Error).message}
            </p>
          )}
          <Button type="submit" busy={signIn.isPending} busyLabel="Signing in…" className="py-2">
            {'Sign in'}
          </Button>
        </form>
        <div className="mt-6 border-t border-ink/10 pt-4">
          <Caution compact />
        </div>
      </div>
    </main>
  );
}
