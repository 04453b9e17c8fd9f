import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../../src/features/auth/components/sign-in-form.component';
import { sessionQueryKey } from '../../src/features/auth/api/get-session.api';
import { jsonResponse, renderWithProviders, testSession } from '../../src/testing/test-utils';

describe('SignInForm', () => {
  it('when submitted empty, then each field shows its own error and nothing is sent', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderWithProviders(<SignInForm onSignedIn={() => {}} />);

    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your email address.')).toBeInTheDocument();
    expect(screen.getByLabelText('Email')).toHaveAccessibleDescription('Enter your email address.');
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription('Enter your password.');
    expect(screen.getByLabelText('Email')).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when the email is malformed, then the email field says so', async () => {
    vi.stubGlobal('fetch', vi.fn());
    renderWithProviders(<SignInForm onSignedIn={() => {}} />);

    await userEvent.type(screen.getByLabelText('Email'), 'not-an-email');
    await userEvent.type(screen.getByLabelText('Password'), 'whatever');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter a valid email address.')).toBeInTheDocument();
    expect(screen.getByLabelText('Password')).not.toHaveAttribute('aria-invalid');
  });

  it('when the server answers 401, then its message shows as a form-level alert', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => jsonResponse(401, { error: { code: 'invalid_credentials', message: 'Email or password is wrong.' } })),
    );
    const onSignedIn = vi.fn();
    renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);

    await userEvent.type(screen.getByLabelText('Email'), 'engineer@example.com');
    await userEvent.type(screen.getByLabelText('Password'), 'wrong-password');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Email or password is wrong.');
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('when the server answers 429, then the rate-limit message is shown', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => jsonResponse(429, { error: { code: 'rate_limited', message: 'Too many sign-in attempts.' } })),
    );
    renderWithProviders(<SignInForm onSignedIn={() => {}} />);

    await userEvent.type(screen.getByLabelText('Email'), 'engineer@example.com');
    await userEvent.type(screen.getByLabelText('Password'), 'x');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Too many sign-in attempts.');
  });

  it('when sign-in succeeds, then it posts the credentials and caches the session', async () => {
    const session = testSession('engineer');
    const fetchMock = vi.fn(async () => jsonResponse(200, session));
    vi.stubGlobal('fetch', fetchMock);
    const onSignedIn = vi.fn();
    const { queryClient } = renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);

    await userEvent.type(screen.getByLabelText('Email'), ' engineer@example.com ');
    await userEvent.type(screen.getByLabelText('Password'), 'baywright-demo');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(session));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/session');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect(JSON.parse(String(init.body))).toEqual({ email: 'engineer@example.com', password: 'baywright-demo' });
    expect(queryClient.getQueryData(sessionQueryKey)).toEqual(session);
  });
});
