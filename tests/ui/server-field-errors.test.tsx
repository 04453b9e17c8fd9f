import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { SignUpForm } from '../../src/features/auth/components/sign-up-form.component';
import { CreateProjectForm } from '../../src/features/projects/components/create-project-form.component';
import { jsonResponse, renderWithProviders, testSession } from '../../src/testing/test-utils';

async function fillSignUp() {
  await userEvent.type(screen.getByLabelText('Firm name'), 'Harrow Lane Structures');
  await userEvent.type(screen.getByLabelText('Your name'), 'Ada Marlow');
  await userEvent.type(screen.getByLabelText('Email'), 'owner@example.com');
  await userEvent.type(screen.getByLabelText('Password'), 'long-enough-pass');
}

describe('server field errors', () => {
  it('when sign-up answers 409 email_taken with fields.email, then the message sits on the Email field', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(409, {
          error: { code: 'email_taken', message: 'That email is taken.', fields: { email: 'An account already uses this email.' } },
        }),
      ),
    );
    const onSignedUp = vi.fn();
    renderWithProviders(<SignUpForm onSignedUp={onSignedUp} />);

    await fillSignUp();
    await userEvent.click(screen.getByRole('button', { name: 'Create firm and sign in' }));

    const email = screen.getByLabelText('Email');
    expect(await screen.findByText('An account already uses this email.')).toBeInTheDocument();
    expect(email).toHaveAccessibleDescription('An account already uses this email.');
    expect(email).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Firm name')).not.toHaveAttribute('aria-invalid');
    // The field carried the message, so no duplicate form-level alert.
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(onSignedUp).not.toHaveBeenCalled();
  });

  it('when the password is shorter than 10 characters, then the Password field says so before any request', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    renderWithProviders(<SignUpForm onSignedUp={() => {}} />);

    await userEvent.type(screen.getByLabelText('Firm name'), 'Harrow Lane Structures');
    await userEvent.type(screen.getByLabelText('Your name'), 'Ada Marlow');
    await userEvent.type(screen.getByLabelText('Email'), 'owner@example.com');
    await userEvent.type(screen.getByLabelText('Password'), 'short');
    await userEvent.click(screen.getByRole('button', { name: 'Create firm and sign in' }));

    expect(await screen.findByText('Use at least 10 characters.')).toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when project creation answers 400 with fields for name and an unknown field, then name gets its message and the rest goes to the form alert', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(400, {
          error: {
            code: 'validation_failed',
            message: 'Check the highlighted fields.',
            fields: { name: 'A project with this name already exists.', units: 'Units must be imperial.' },
          },
        }),
      ),
    );
    renderWithProviders(<CreateProjectForm onCreated={() => {}} />, { session: testSession('engineer') });

    await userEvent.type(screen.getByLabelText('Project name'), 'Millbrook Clinic');
    await userEvent.click(screen.getByRole('button', { name: 'Create project' }));

    expect(await screen.findByText('A project with this name already exists.')).toBeInTheDocument();
    expect(screen.getByLabelText('Project name')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('Units must be imperial.');
  });
});
