import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { PortionScreen, UNDO_MS } from '@/components/kitchen/portion-screen';
import { localToday } from '@/components/kitchen/kitchen-format';
import type { PortionDetail } from '@/shared/schemas/portion';
import { fakeApi, renderSignedIn } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

const addDays = (days: number) => {
  const d = new Date(`${localToday()}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

// Invented numbers: these tests check what the page offers, not any arithmetic.
function portion(extra: Partial<PortionDetail> = {}): PortionDetail {
  return {
    id: 1, code: 'ABC234', batchId: 5, profileId: 1, position: 1, containerName: null, grossGrams: null, tareGrams: null,
    netGrams: 226, carb: { grams: 39, inUnit: 39 }, status: 'available', statusChangedAt: null, recipeTitle: 'Overnight oats',
    recipeId: 2, cookedOn: addDays(-1), useBy: addDays(1), storage: 'fridge', carbPer100g: { grams: 17, inUnit: 17 },
    basis: 'available', unit: 'g', profileName: 'Robin', ...extra,
  };
}

describe('portion page', () => {
  it('offers Undo for a few seconds after "Thrown away", and Undo sends the portion back to not eaten yet', async () => {
    const api = fakeApi({
      'GET /portions/ABC234': [200, portion()],
      'POST /portions/ABC234/status': (body) => [200, portion({ status: (body as { status: PortionDetail['status'] }).status, statusChangedAt: '2026-03-11T08:00:00.000Z' })],
    });
    renderSignedIn(() => <PortionScreen code="ABC234" />);

    fireEvent.click(await screen.findByRole('button', { name: 'Thrown away' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Undo' }));

    await screen.findByRole('button', { name: 'Log this meal' });
    const sent = api.mock.calls.filter(([, init]) => init?.method === 'POST').map(([, init]) => JSON.parse(String(init!.body)));
    expect(sent).toEqual([{ status: 'discarded' }, { status: 'available' }]);
  });

  it('takes the Undo away after UNDO_MS', async () => {
    jest.useFakeTimers({ advanceTimers: true });
    fakeApi({
      'GET /portions/ABC234': [200, portion()],
      'POST /portions/ABC234/status': [200, portion({ status: 'discarded', statusChangedAt: '2026-03-11T08:00:00.000Z' })],
    });
    renderSignedIn(() => <PortionScreen code="ABC234" />);
    fireEvent.click(await screen.findByRole('button', { name: 'Thrown away' }));
    await screen.findByRole('button', { name: 'Undo' });

    act(() => jest.advanceTimersByTime(UNDO_MS + 1));

    await waitFor(() => expect(screen.queryByRole('button', { name: 'Undo' })).toBeNull());
    expect(screen.getByText(/Thrown away/)).toBeInTheDocument();
    jest.useRealTimers();
  });

  it.each([
    { name: 'a fridge portion within its use-by date', extra: {}, dose: true },
    { name: 'a fridge portion past its use-by date', extra: { useBy: addDays(-2) }, dose: false },
    { name: 'a freezer portion past its best-quality date (safe while frozen)', extra: { useBy: addDays(-2), storage: 'freezer' as const }, dose: true },
  ])('offers a dose check and "Log this meal" for $name: $dose', async ({ extra, dose }) => {
    fakeApi({ 'GET /portions/ABC234': [200, portion(extra)] });
    renderSignedIn(() => <PortionScreen code="ABC234" />);

    await screen.findByRole('button', { name: 'Thrown away' });

    expect(screen.queryByRole('button', { name: 'Check a dose for this' }) != null).toBe(dose);
    expect(screen.queryByRole('button', { name: 'Log this meal' }) != null).toBe(dose);
    expect(screen.queryByRole('button', { name: 'Mark eaten' })).toBeNull();
  });
});
