import { TextEncoder } from 'node:util';
import { fireEvent, render, screen } from '@testing-library/react';
import { ExpoRoot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import { SignUpScreen } from '@/components/auth/sign-up-screen';
import { sessionCookie } from '@/components/auth/session-cookie';
import { installPasswordEstimator } from '@/shared/compute/password';
import { createPasswordEstimator } from '@/shared/compute/password-estimator';
import { AppRoot } from './render-with-api';

// The common-password dictionaries are a chunk of their own that the web app loads when a screen that sets a password
// opens (components/auth/use-password-estimator.ts; jest has no dynamic import, so the test installs them as that
// load does). Once installed, the form refuses a common password itself, before any request.
// jsdom has no TextEncoder (the password rule counts UTF-8 bytes with it, as browsers and Node do).
Object.assign(globalThis, { TextEncoder: globalThis.TextEncoder ?? TextEncoder });

describe('SignUpScreen password check', () => {
  beforeEach(() => {
    sessionCookie.clear();
    (globalThis as { fetch: unknown }).fetch = jest.fn();
  });

  it('refuses a common password under the field once the dictionaries have loaded, and sends nothing', async () => {
    render(<ExpoRoot context={getMockContext({ _layout: AppRoot, 'sign-up': SignUpScreen })} location="/sign-up" />);

    fireEvent.change(await screen.findByLabelText('Your name'), { target: { value: 'Robin' } });
    fireEvent.change(screen.getByLabelText('Email'), { target: { value: 'robin@example.test' } });
    // "password123" is in zxcvbn-ts's common-password list (tests/shared/password.test.ts: "a common password with digits").
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'password123' } });
    installPasswordEstimator(createPasswordEstimator());
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText(/commonly used password/)).toBeInTheDocument();
    expect(globalThis.fetch).not.toHaveBeenCalled();
  });
});
