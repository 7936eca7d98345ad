import { render, screen } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { ExpoRoot, Slot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import type { ReactElement } from 'react';
import { createQueryClient } from '@/components/api/query-client';
import { SessionProvider } from '@/components/auth/session';
import type { Me } from '@/shared/schemas/auth';

/** One answer of the fake API: a status and a JSON body. */
export type Reply = [status: number, body?: unknown];
/** "METHOD /path" (path without /api, query string included) → the reply, or a function of the sent body. */
export type Routes = Record<string, Reply | ((body: unknown) => Reply)>;

export const ME: Me = {
  user: { id: 1, email: 'cook@example.test', displayName: 'Robin', role: 'member', createdAt: '2026-03-01T00:00:00.000Z' },
  profiles: [{ id: 1, displayName: 'Robin', access: 'owner', permissions: [], colour: 'teal', managed: false, glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', preferredFoodTable: 'usda_sr28', timeZone: 'UTC' }],
};

/**
 * Answers fetch from `routes` (matched on method and the path up to "?" when no exact match); an unknown call fails
 * the test loudly. Returns the mock, so a test can check what was sent.
 */
export function fakeApi(routes: Routes) {
  const all: Routes = { 'GET /me': [200, ME], ...routes };
  const mock = jest.fn(async (url: string, init: RequestInit = {}) => {
    const path = url.replace(/^.*?\/api/, '');
    const method = init.method ?? 'GET';
    const route = all[`${method} ${path}`] ?? all[`${method} ${path.split('?')[0]}`];
    if (!route) throw new Error(`No fake answer for ${method} ${path}`);
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : init.body;
    const [status, json] = typeof route === 'function' ? route(body) : route;
    return { status, ok: status < 300, text: () => Promise.resolve(json === undefined ? '' : JSON.stringify(json)), blob: () => Promise.resolve(new Blob()) };
  });
  (globalThis as { fetch: unknown }).fetch = mock;
  return mock;
}

/** A field error answer in the API's one error shape. */
export const fieldErrors = (errors: Record<string, string[]>): Reply => [400, { error: { code: 'validation_failed', message: 'Some fields need a look.', fieldErrors: errors } }];

/** The app's providers around the routes: a fresh query client and the session. */
export function AppRoot() {
  return (
    <QueryClientProvider client={createQueryClient()}>
      <SessionProvider>
        <Slot />
      </SessionProvider>
    </QueryClientProvider>
  );
}

/** Renders `Screen` signed in, inside the router, the query client and the session, as the app does. */
export function renderSignedIn(Screen: () => ReactElement) {
  document.cookie = 'cw_csrf=test-csrf; path=/';
  return render(<ExpoRoot context={getMockContext({ _layout: AppRoot, index: Screen })} location="/" />);
}

/** The message sits in the field's own box, right under the input, and the input is marked invalid. */
export async function expectErrorUnder(label: string, message: string) {
  const text = await screen.findByText(message);
  const input = screen.getByLabelText(label, { selector: 'input, textarea' });
  expect(input).toHaveAttribute('aria-invalid', 'true');
  const field = input.parentElement!.parentElement!;
  expect(field).toContainElement(text);
}
