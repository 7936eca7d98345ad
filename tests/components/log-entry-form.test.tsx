import { fireEvent, screen, waitFor } from '@testing-library/react';
import { EntryCorrections } from '@/components/logbook/entry-corrections';
import { AddEntryScreen } from '@/components/logbook/add-entry-screen';
import type { LogEntry } from '@/shared/schemas/logbook';
import { expectErrorUnder, fakeApi, fieldErrors, renderSignedIn } from './render-with-api';

jest.setTimeout(30_000);

// Invented entries and day kinds: these tests check what is sent and shown, not any dose arithmetic.
const entry = (kind: LogEntry['kind'], extra: Partial<LogEntry> = {}): LogEntry => ({
  id: 7, profileId: 1, kind, occurredAt: '2026-03-11T07:30:00.000Z', localDate: '2026-03-11', localTime: '07:30', timeZone: 'UTC',
  dayKindId: 1, dayKindName: 'Work day', groupKey: null, enteredBy: { id: 1, name: 'Robin' }, meal: null, reading: null, dose: null,
  exercise: null, note: null, changed: false, deleted: false, createdAt: '2026-03-11T07:31:00.000Z', ...extra,
});
const DAY_KINDS = { dayKinds: [{ id: 1, name: 'Work day', isDefault: true, longActingUnits: 14, timesOfDay: [] }, { id: 2, name: 'Rest day', isDefault: false, longActingUnits: 12, timesOfDay: [] }] };
const routes = (post: Parameters<typeof fakeApi>[0][string]) => ({
  'GET /profiles/1/day-kinds': [200, DAY_KINDS] as [number, unknown],
  'GET /profiles/1/days': [200, { days: [{ date: '2026-03-11', dayKindId: 2, dayKindName: 'Rest day', isSet: true }] }] as [number, unknown],
  'POST /profiles/1/log-entries': post,
});
const sentBodies = (api: ReturnType<typeof fakeApi>, method: string) =>
  api.mock.calls.filter(([, init]) => init?.method === method).map(([, init]) => JSON.parse(String(init!.body)));

describe('Add an entry', () => {
  it('sends a long-acting dose in units, with the planned units of the day kind in force shown beside the field', async () => {
    const api = fakeApi(routes([201, { groupKey: 'g', entries: [entry('long_dose', { dose: { units: 13, suggestion: null, plannedUnits: 12 } })] }]));
    renderSignedIn(AddEntryScreen);

    fireEvent.click(await screen.findByRole('radio', { name: 'Long-acting dose' }));
    // The date's kind is "Rest day" (12 units planned), not the default "Work day".
    expect(await screen.findByText('Planned for Rest day: 12 units.')).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Long-acting insulin'), { target: { value: '13' } });
    fireEvent.change(screen.getByLabelText('Note (optional)'), { target: { value: 'left thigh' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save entry' }));

    await screen.findByText(/Saved: Long-acting dose 13 units at 07:30/);
    expect(sentBodies(api, 'POST')).toEqual([{ kind: 'long_dose', units: 13, note: 'left thigh' }]);
  });

  it('sends a reading in the profile unit with the time 20 minutes ago', async () => {
    const api = fakeApi(routes([201, { groupKey: 'g', entries: [entry('reading', { reading: { glucose: 6.4, source: 'typed' } })] }]));
    renderSignedIn(AddEntryScreen);

    fireEvent.change(await screen.findByLabelText('Glucose'), { target: { value: '6,4' } });
    fireEvent.click(screen.getByRole('radio', { name: 'Minutes ago' }));
    fireEvent.change(screen.getByLabelText('How many minutes ago'), { target: { value: '20' } });
    const before = Date.now();
    fireEvent.click(screen.getByRole('button', { name: 'Save entry' }));

    await screen.findByText(/Saved: Glucose reading 6.4 mmol\/L/);
    const [body] = sentBodies(api, 'POST');
    expect(body).toMatchObject({ kind: 'reading', glucose: 6.4, glucoseUnit: 'mmol_l' });
    const minutesAgo = (before - Date.parse(body.occurredAt)) / 60_000;
    expect(minutesAgo).toBeGreaterThan(19.9);
    expect(minutesAgo).toBeLessThan(20.5);
  });

  it("puts the server's field error under its field", async () => {
    fakeApi(routes(fieldErrors({ units: ['Use more than 0 and at most 100 units.'] })));
    renderSignedIn(AddEntryScreen);

    fireEvent.click(await screen.findByRole('radio', { name: 'Rapid-acting dose' }));
    fireEvent.change(screen.getByLabelText('Rapid-acting insulin'), { target: { value: '4' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save entry' }));

    await expectErrorUnder('Rapid-acting insulin', 'Use more than 0 and at most 100 units.');
  });
});

describe('Corrections in History', () => {
  const units = { glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g' } as const;

  it('edits a dose through PATCH and lists a changed entry before → after, who and when', async () => {
    const dose = entry('long_dose', { changed: true, dose: { units: 12, suggestion: null, plannedUnits: 12 } });
    const edited = { ...dose, dose: { units: 14, suggestion: null, plannedUnits: 12 } };
    const api = fakeApi({
      'PATCH /profiles/1/log-entries/7': [200, edited],
      'GET /profiles/1/log-entries/7/changes': [200, [{ id: 1, action: 'edit', changedBy: { id: 2, name: 'Sam' }, changedAt: '2026-03-11T08:05:00.000Z', before: dose, after: edited }]],
    });
    renderSignedIn(() => <EntryCorrections profileId={1} entry={dose} units={units} />);

    fireEvent.click(await screen.findByRole('button', { name: /^Edit long-acting dose of .* 07:30$/ }));
    fireEvent.change(screen.getByLabelText('Insulin'), { target: { value: '14' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save correction' }));
    await waitFor(() => expect(sentBodies(api, 'PATCH')).toEqual([{ units: 14, note: null }]));

    fireEvent.click(screen.getByRole('button', { name: /^Changes to long-acting dose of .* 07:30$/ }));
    const item = await screen.findByRole('listitem');
    expect(item).toHaveTextContent('Edited by Sam');
    expect(item).toHaveTextContent('08:05');
    expect(item).toHaveTextContent('07:30 · 12 units → 07:30 · 14 units');
  });

  it('deletes only after the confirm step', async () => {
    const api = fakeApi({ 'DELETE /profiles/1/log-entries/7': [200, { ...entry('reading'), deleted: true }] });
    renderSignedIn(() => <EntryCorrections profileId={1} entry={entry('reading', { reading: { glucose: 5.5, source: 'typed' } })} units={units} />);

    fireEvent.click(await screen.findByRole('button', { name: /^Delete glucose reading of .* 07:30$/ }));
    expect(api.mock.calls.some(([, init]) => init?.method === 'DELETE')).toBe(false);
    fireEvent.click(screen.getByRole('button', { name: 'Yes, delete' }));
    await waitFor(() => expect(api.mock.calls.filter(([, init]) => init?.method === 'DELETE')).toHaveLength(1));
  });
});
