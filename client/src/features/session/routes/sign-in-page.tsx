import { redirect, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { queryClient } from '@client/lib/query-client';
import { buttonClasses } from '@client/components/ui/button';
import { Wordmark } from '@client/components/ui/wordmark';
import { meQueryOptions } from '../api/get-me';
import { safeReturnTo } from '../lib/return-to';

/** Someone already signed in goes straight on to where they were heading. */
export async function signInLoader({ request }: LoaderFunctionArgs) {
  const returnTo = safeReturnTo(new URL(request.url).searchParams.get('returnTo'));
  try {
    await queryClient.ensureQueryData(meQueryOptions());
  } catch {
    // 401 (the usual case) or a server that is unwell: either way, offer the sign-in button.
    return null;
  }
  throw redirect(returnTo);
}

/**
 * /signin: what Bondmark is, one button that starts single sign-on
 * (a plain GET form to /auth/login?returnTo=...), and a note for students.
 */
export function SignInPage() {
  const [searchParams] = useSearchParams();
  const returnTo = safeReturnTo(searchParams.get('returnTo'));
  const failure = searchParams.get('error');

  return (
    <div className="flex min-h-screen flex-col">
      <title>Sign in · Bondmark</title>
      <main id="main" tabIndex={-1} className="flex flex-1 items-start justify-center px-4 py-12 outline-none sm:items-center">
        <div className="w-full max-w-[34rem]">
          <Wordmark size="lg" />
          <div className="mt-6 rounded-[3px] border border-rule bg-sheet px-6 py-6 sm:px-8">
            <h1 className="font-serif text-[1.6rem] leading-tight font-semibold">Sign in</h1>
            <p className="mt-3 text-ink">
              Bondmark runs the computational lab sections of molecular-orbital courses. It computes the reference
              curves and answer key for every student&rsquo;s variant, marks uploaded reports against them, and gives
              lecturers and assistants one table in which to review marks, write feedback and return reports &mdash;
              then exports the marks for the registrar.
            </p>

            {failure ? (
              <p role="alert" className="mt-4 border-l-[3px] border-antibonding bg-paper px-3 py-2 text-ink" data-testid="signin-error">
                Sign-in did not complete <span className="num text-graphite">({failure})</span>. Try again; if it keeps
                failing, ask your department&rsquo;s Bondmark administrator.
              </p>
            ) : null}

            <form method="get" action="/auth/login" className="mt-6">
              <input type="hidden" name="returnTo" value={returnTo} />
              <button type="submit" className={buttonClasses('primary') + ' w-full sm:w-auto'} data-testid="signin-button">
                Sign in with your university account
              </button>
            </form>
            {returnTo !== '/' ? (
              <p className="mt-2 text-sm text-graphite">
                Afterwards you will be taken back to <code className="num">{returnTo}</code>.
              </p>
            ) : null}

            <div className="mt-6 border-t border-rule pt-4 text-[0.92rem] text-graphite">
              <p>
                <strong className="font-semibold text-student">Students:</strong> sign in with the same university account
                to download your personal template, upload your report, see its automatic mark and read the feedback once it is returned.
                Bondmark does not keep a separate password.
              </p>
            </div>
          </div>
        </div>
      </main>
    </div>
  );
}
