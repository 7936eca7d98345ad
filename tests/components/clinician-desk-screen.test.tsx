import { fireEvent, render, screen, within } from '@testing-library/react';
import { ExpoRoot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import { Text } from 'react-native';
import { activeProfileStore } from '@/components/auth/active-profile-store';
import { ClinicianDeskScreen } from '@/components/desk/clinician-desk-screen';
import { OfferToMyPeople } from '@/components/recipes/offer-to-my-people';
import { PlanScreen } from '@/components/plan/plan-screen';
import { DayKindsScreen } from '@/components/settings/day-kinds-screen';
import type { Me } from '@/shared/schemas/auth';
import type { ClinicianDesk, DeskPerson } from '@/shared/schemas/clinician-desk';
import type { PlanWeek } from '@/shared/schemas/plan';
import { AppRoot, fakeApi, renderSignedIn } from './render-with-api';

const summary = { managed: false, glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', preferredFoodTable: 'usda_sr28', timeZone: 'UTC' } as const;
const NURSE: Me = {
  user: { id: 5, email: 'nurse@example.test', displayName: 'Sam', role: 'clinician', createdAt: '2026-03-01T00:00:00.000Z' },
  profiles: [
    { ...summary, id: 11, displayName: 'Ada', access: 'clinician', permissions: [], colour: 'teal' },
    { ...summary, id: 12, displayName: 'Bea', access: 'clinician', permissions: ['ratios'], colour: 'plum' },
  ],
};

const person = (over: Partial<DeskPerson>): DeskPerson => ({
  profileId: 11,
  displayName: 'Ada',
  colour: 'teal',
  permissions: [],
  since: '2026-03-01T00:00:00.000Z',
  glucoseUnit: 'mmol_l',
  carbBasis: 'available',
  carbUnit: 'g',
  period: { from: '2026-03-01', to: '2026-03-14' },
  lastMeal: null,
  targetRange: { lowMmol: 5, highMmol: 8, fromProfile: true },
  timeInRange: { readings: 0, belowPercent: null, inPercent: null, abovePercent: null },
  review: { mealsInPeriod: 0, mealsUsed: 0, minimumMeals: 5, flagLimitMmol: 2, flags: [] },
  ...over,
});

/** The desk as the API answers it (the hand-counted log of tests/server/clinician-desk.routes.test.ts, in short). */
const DESK: ClinicianDesk = {
  caution: 'This review shows what happened; it does not suggest a new ratio.',
  people: [
    person({
      lastMeal: { occurredAt: '2026-03-12T12:30:00.000Z', localDate: '2026-03-12', localTime: '12:30', title: 'Lentil soup', carbG: 55 },
      // 1, 5 and 5 of 11 readings
      timeInRange: { readings: 11, belowPercent: 100 / 11, inPercent: 500 / 11, abovePercent: 500 / 11 },
      review: { mealsInPeriod: 6, mealsUsed: 5, minimumMeals: 5, flagLimitMmol: 2, flags: [{ dayKindId: 3, dayKindName: 'Rest', startMinute: 0, endMinute: 660, direction: 'rose', meals: 5, averageChangeMmol: 3 }] },
    }),
    person({ profileId: 12, displayName: 'Bea', colour: 'plum', permissions: ['ratios'] }),
  ],
  invitations: [{ id: 9, profileName: 'Cy', colour: 'amber', inviterName: 'Cy', role: 'clinician', permissions: [], expiresAt: '2026-03-20T10:00:00.000Z', createdAt: '2026-03-13T10:00:00.000Z' }],
};

function renderDesk() {
  document.cookie = 'cw_csrf=test-csrf; path=/';
  const LogbookPage = () => <Text>The logbook page</Text>;
  return render(<ExpoRoot context={getMockContext({ _layout: AppRoot, index: ClinicianDeskScreen, 'logbook/index': LogbookPage })} location="/" />);
}

describe('ClinicianDeskScreen', () => {
  it('shows each person with last meal, time in range and flags in words, and the invitation waiting', async () => {
    fakeApi({ 'GET /me': [200, NURSE], 'GET /clinician-desk': [200, DESK] });

    renderDesk();
    const ada = await screen.findByLabelText('Ada');

    expect(within(ada).getByText(/Lentil soup · 55 g/)).toBeInTheDocument();
    // 500/11 = 45.45… → "45 %"; 100/11 = 9.09… → "9 %"
    expect(within(ada).getByText(/^45 % in range, 9 % below, 45 % above · 11 readings/)).toBeInTheDocument();
    expect(within(ada).getByText(/Rest · 00:00–11:00: glucose rose \+3\.0 mmol\/L on\s+average after 5 meals/)).toBeInTheDocument();
    expect(within(ada).getByText('You read only')).toBeInTheDocument();
    const bea = screen.getByLabelText('Bea');
    expect(within(bea).getByText('No meal logged yet')).toBeInTheDocument();
    expect(within(bea).getByText('You may change kinds of day and ratios')).toBeInTheDocument();
    expect(within(bea).getByText(/^None: no time of day/)).toBeInTheDocument();
    expect(screen.getByRole('list', { name: 'Invitations waiting for you' })).toHaveTextContent("Cy invited you as clinician to Cy's profile");
  }, 20_000);

  it('opens a person by making their profile the active one and going to their logbook', async () => {
    fakeApi({ 'GET /me': [200, NURSE], 'GET /clinician-desk': [200, DESK] });
    activeProfileStore.set(12);

    renderDesk();
    fireEvent.click(await screen.findByRole('button', { name: "Open Ada's logbook" }));

    expect(await screen.findByText('The logbook page')).toBeInTheDocument();
    expect(activeProfileStore.get()).toBe(11);
  });

  it('says so when the clinician supports nobody yet', async () => {
    fakeApi({ 'GET /me': [200, NURSE], 'GET /clinician-desk': [200, { people: [], invitations: [], caution: DESK.caution }] });

    renderDesk();

    expect(await screen.findByText('Nobody on your desk yet')).toBeInTheDocument();
  });
});

describe('what a clinician sees on the screens the desk opens', () => {
  const KINDS = { dayKinds: [{ id: 3, name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }], updatedAt: '2026-03-01T00:00:00.000Z' }] };

  it.each([
    { name: 'a clinician reads the day kinds without edit buttons', active: 11, edit: false },
    { name: 'a clinician the owner allowed ratios gets them', active: 12, edit: true },
  ])('$name', async ({ active, edit }) => {
    fakeApi({ 'GET /me': [200, NURSE], [`GET /profiles/${active}/day-kinds`]: [200, KINDS] });
    activeProfileStore.set(active);

    renderSignedIn(DayKindsScreen);
    await screen.findByRole('heading', { name: 'Rest' });

    // Link-wrapped buttons: found by their words, whatever role the link gives them.
    expect(screen.queryByText('Edit Rest') != null).toBe(edit);
    expect(screen.queryByText('Add a day kind') != null).toBe(edit);
  });
  const none = { carbGrams: 0, carbIncomplete: false, rapidUnits: 0, rapidIncomplete: false, longActingUnits: null };
  const WEEK: PlanWeek = {
    weekStart: '2026-03-02', today: '2026-03-02', timeZone: 'UTC', basis: 'available', unit: 'g', doseReady: false,
    days: Array.from({ length: 7 }, (_, i) => ({ date: `2026-03-0${2 + i}`, weekday: i + 1, dayKind: null, meals: [], totals: none })),
    cooks: [], use: [], totals: none, warnings: [],
  };

  it.each([
    { name: 'a clinician reads the plan without its write buttons', me: NURSE, active: 11, write: false },
    { name: 'the owner gets them', me: undefined, active: 1, write: true },
  ])('$name', async ({ me, active, write }) => {
    fakeApi({ ...(me ? { 'GET /me': [200, me] } : {}), [`GET /profiles/${active}/plan/week`]: [200, WEEK] });
    activeProfileStore.set(active);

    renderSignedIn(PlanScreen);
    await screen.findByLabelText('Week totals');

    expect(screen.queryByText('Plan a meal') != null).toBe(write);
    expect(screen.queryByText('Plan a cook') != null).toBe(write);
    expect(screen.queryByText('Weekly pattern and meals') != null).toBe(write);
    expect(screen.getByText('Shopping list')).toBeInTheDocument();
  });
});

describe('OfferToMyPeople', () => {
  it('offers the recipe to everyone the clinician supports and says how many', async () => {
    const api = fakeApi({ 'GET /me': [200, NURSE], 'POST /recipes/4/offers-to-my-people': [202, { status: 'offered', people: 2 }] });

    renderSignedIn(() => <OfferToMyPeople recipeId={4} />);
    fireEvent.click(await screen.findByRole('button', { name: 'Offer to everyone I support' }));

    expect(await screen.findByText('Offered to 2 people. Each one accepts or declines.')).toBeInTheDocument();
    expect(api).toHaveBeenCalledWith(expect.stringMatching(/\/api\/recipes\/4\/offers-to-my-people$/), expect.objectContaining({ method: 'POST' }));
  });
});
