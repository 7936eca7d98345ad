import { fireEvent, screen, waitFor } from '@testing-library/react';
import { LogMealPanel } from '@/components/dose/log-meal-panel';
import type { DoseRequest, DoseSuggestion } from '@/shared/schemas/dose';
import { fakeApi, renderSignedIn } from './render-with-api';

jest.setTimeout(30_000);

// Invented numbers: these tests check what is sent and offered, not the dose arithmetic.
const request: DoseRequest = { carbsGrams: 39, glucose: 7.2, glucoseUnit: 'mmol_l', glucoseTakenAt: '2026-03-11T07:30:00.000Z', mealAt: '2026-03-11T07:30:00.000Z', localTime: '07:30' };
const suggestion = {
  status: 'ok', dayKind: { id: 1, name: 'Rest' }, timeOfDay: { startMinute: 0, endMinute: 1440 }, warnings: [], recentDoses: [],
  breakdown: { doseUnits: 4 }, split: { nowUnits: 2.5, laterUnits: 1.5, laterMinutes: 60, nowPercent: 60 }, fatProteinUnits: null,
  caution: { version: 'c1', title: 'A calculation, not medical advice', text: 'x' }, engineVersion: 'e1', loggedDoses: [],
  glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', mealAt: request.mealAt, glucoseTakenAt: request.glucoseTakenAt,
} as unknown as DoseSuggestion;

const entry = (kind: string, extra: object = {}) => ({ id: 1, kind, localTime: '07:30', dose: null, ...extra });
const GROUP = '0b8f7c9e-1f2a-4c3b-9d4e-5f6a7b8c9d0e';

describe('LogMealPanel', () => {
  it('starts with both parts of the suggestion, saves meal, reading and doses as taken, and undoes them with one tap', async () => {
    const api = fakeApi({
      'POST /profiles/1/log-entries/meals': [201, { groupKey: GROUP, entries: [entry('meal'), entry('reading'), entry('rapid_dose', { dose: { units: 2 } }), entry('rapid_dose', { dose: { units: 1.5 } })] }],
      [`POST /profiles/1/log-groups/${GROUP}/undo`]: [200, { groupKey: GROUP, entries: [] }],
    });
    renderSignedIn(() => <LogMealPanel profileId={1} request={request} suggestion={suggestion} portionCode="ABC234" label="Overnight oats" planMealId={9} />);

    const now = (await screen.findByLabelText(/Taken now/)) as HTMLInputElement;
    expect(now.value).toBe('2.5');
    expect((screen.getByLabelText(/Later part/) as HTMLInputElement).value).toBe('1.5');
    fireEvent.change(now, { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save to the logbook' }));
    await screen.findByText(/Saved in the logbook/);
    fireEvent.click(screen.getByRole('button', { name: 'Undo' }));
    await screen.findByText(/Undone/);

    const posts = api.mock.calls.filter(([, init]) => init?.method === 'POST');
    const body = JSON.parse(String(posts[0][1]!.body));
    expect(body).toMatchObject({
      meal: { source: 'portion', portionCode: 'ABC234' },
      reading: { glucose: 7.2, glucoseUnit: 'mmol_l' },
      doses: [{ units: 2, occurredAt: '2026-03-11T07:30:00.000Z' }, { units: 1.5, occurredAt: '2026-03-11T08:30:00.000Z' }],
      suggestion: { caution: { version: 'c1' }, engineVersion: 'e1' },
      planMealId: 9,
    });
    expect(posts[1][0]).toMatch(new RegExp(`/log-groups/${GROUP}/undo$`));
  });

  it('shows the server message when the portion was eaten on another device', async () => {
    fakeApi({ 'POST /profiles/1/log-entries/meals': [409, { error: { code: 'conflict', message: 'This portion has already been eaten or thrown away, so it was not logged again. Nothing was saved.' } }] });
    renderSignedIn(() => <LogMealPanel profileId={1} request={request} suggestion={suggestion} portionCode="ABC234" />);

    fireEvent.click(await screen.findByRole('button', { name: 'Save to the logbook' }));

    await waitFor(() => expect(screen.getByText(/already been eaten/)).toBeInTheDocument());
    expect(screen.getByText(/Not saved/)).toBeInTheDocument();
  });
});
