import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { ExpoRoot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import { Text } from 'react-native';
import { SignInScreen } from '@/components/auth/sign-in-screen';
import { sessionCookie } from '@/components/auth/session-cookie';
import { AppRoot } from './render-with-api';

function renderAt(location: string) {
  const context = getMockContext({
    _layout: AppRoot,
    'sign-in': SignInScreen,
    index: () => <Text>Home page</Text>,
    plan: () => <Text>Plan page</Text>,
  });
  return render(<ExpoRoot context={context} location={location} />);
}

function respond(status: number, body: unknown) {
  (globalThis as { fetch: unknown }).fetch = jest.fn().mockResolvedValue({ status, ok: status < 300, text: () => Promise.resolve(JSON.stringify(body)) });
}

beforeEach(() => {
  sessionCookie.clear();
});

describe('SignInScreen', () => {
  it('shows a message under each empty field and sends nothing', async () => {
    respond(200, {});
    renderAt('/sign-in');

    fireEvent.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your email address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
    expect(globalThis.fetch).not.toHaveBeenCalled();
  });

  it('shows the server message plainly when the password is wrong', async () => {
    respond(401, { error: { code: 'unauthorized', message: 'Email or password is not right.' } });
    renderAt('/sign-in');

    fireEvent.change(await screen.findByLabelText('Email'), { target: { value: 'cook@example.test' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'wrong one' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Email or password is not right.')).toBeInTheDocument();
    expect(sessionCookie.csrf()).toBeNull();
  });

  it('goes to the page asked for after signing in, keeping no token in the page', async () => {
    const me = { user: { id: 1, email: 'cook@example.test', displayName: 'Cook', role: 'member', createdAt: '2026-01-01T00:00:00.000Z' }, profiles: [] };
    respond(200, { token: 'token-abc', expiresAt: '2026-12-31T00:00:00.000Z', me });
    renderAt('/sign-in?next=%2Fplan');

    fireEvent.change(await screen.findByLabelText('Email'), { target: { value: 'Cook@Example.test' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'the right password' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Plan page')).toBeInTheDocument();
    const [, init] = (globalThis.fetch as jest.Mock).mock.calls[0];
    expect(init.credentials).toBe('same-origin');
    expect(new Headers(init.headers).get('Authorization')).toBeNull();
    expect(JSON.stringify(globalThis.localStorage ?? {})).not.toContain('token-abc');
    expect(JSON.parse(init.body)).toEqual({ email: 'cook@example.test', password: 'the right password' });
  });
});
