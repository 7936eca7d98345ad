import { Op, QueryTypes } from 'sequelize';
import { ratioReview, REVIEW_FLAG_CHANGE_MMOL, REVIEW_MINIMUM_MEALS, reviewFlags } from '../../shared/compute/logbook-review';
import { toLocalTime } from '../../shared/compute/local-time';
import { addDaysIso } from '../../shared/compute/plan';
import { DESK_DAYS, type ClinicianDesk, type DeskInvitation, type DeskPerson } from '../../shared/schemas/clinician-desk';
import { RATIO_REVIEW_CAUTION } from '../../shared/schemas/logbook-read';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import { AppError } from '../errors';
import { DayKindModel, InvitationModel, ProfileAccessModel, ProfileModel, ProfileSettingsModel, UserModel } from '../models';
import { withTimesOfDay } from './day-kinds.service';
import { periodEntriesOf, periodTimeInRange, REVIEW_DAY_KIND_ORDER, reviewTimesOfDay, targetRangeOf } from './log-history.service';

type Grant = ProfileAccessModel & { profile: ProfileModel };

/** The profiles the user holds as clinician, with the profile loaded (one query). */
export async function clinicianGrants(userId: number): Promise<Grant[]> {
  const rows = await ProfileAccessModel.findAll({ where: { userId, role: 'clinician' }, include: [{ model: ProfileModel, as: 'profile', required: true }] });
  return (rows as Grant[]).sort((a, b) => a.profile.displayName.localeCompare(b.profile.displayName) || a.profileId - b.profileId);
}

type LastMealRow = { profile_id: number; occurred_at: Date; local_date: string; local_minute: number; title: string | null; carb_available_g: number | null; carb_total_g: number | null };

/** The latest meal of each profile (any date), in one query. */
async function lastMeals(profileIds: number[]): Promise<Map<number, LastMealRow>> {
  if (!profileIds.length) return new Map();
  const rows = await ProfileModel.sequelize!.query<LastMealRow>(
    `SELECT DISTINCT ON (profile_id) profile_id, occurred_at, local_date::text AS local_date, local_minute, title, carb_available_g, carb_total_g
       FROM log_entries
      WHERE profile_id IN (:profileIds) AND kind = 'meal' AND deleted_at IS NULL
      ORDER BY profile_id, occurred_at DESC, id DESC`,
    { replacements: { profileIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.profile_id, r]));
}

/** Invitations addressed to this address, still open (not accepted, withdrawn or expired), newest first. */
async function openInvitationsTo(email: string, now: Date): Promise<DeskInvitation[]> {
  const rows = await InvitationModel.findAll({
    where: { email, acceptedAt: null, cancelledAt: null, expiresAt: { [Op.gt]: now } },
    include: [{ model: ProfileModel, as: 'profile', required: true }, { model: UserModel, as: 'invitedBy' }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return rows.map((i) => ({
    id: i.id,
    profileName: i.profile!.displayName,
    colour: i.profile!.colour,
    inviterName: i.invitedBy?.displayName ?? 'Someone',
    role: i.role,
    permissions: i.permissions,
    expiresAt: i.expiresAt.toISOString(),
    createdAt: i.createdAt.toISOString(),
  }));
}

/**
 * The clinician's desk: each person whose profile the user holds as clinician, with their last meal, time in range
 * over the last DESK_DAYS local days and the ratio review's flags — computed by the same rules and queries as the
 * logbook's charts and review, for every person at once — and the invitations waiting for the user's address.
 */
export async function clinicianDesk(userId: number, now = new Date()): Promise<ClinicianDesk> {
  const user = await UserModel.findByPk(userId);
  if (!user) throw AppError.unauthorized();
  const grants = await clinicianGrants(userId);
  const ids = grants.map((g) => g.profileId);
  const periods = grants.map((g) => {
    const to = toLocalTime(now, g.profile.timeZone).localDate;
    return { profileId: g.profileId, from: addDaysIso(to, -(DESK_DAYS - 1)), to, basis: g.profile.carbBasis };
  });
  const [settings, kinds, entries, meals, invitations] = await Promise.all([
    ids.length ? ProfileSettingsModel.findAll({ where: { profileId: { [Op.in]: ids } } }) : [],
    ids.length ? DayKindModel.findAll({ where: { profileId: { [Op.in]: ids } }, ...withTimesOfDay, order: REVIEW_DAY_KIND_ORDER }) : [],
    periodEntriesOf(periods),
    lastMeals(ids),
    openInvitationsTo(user.email, now),
  ]);
  const people: DeskPerson[] = grants.map((g, i) => {
    const p = g.profile;
    const range = targetRangeOf(settings.find((s) => s.profileId === p.id) ?? null);
    const mine = entries.get(p.id)!;
    const review = ratioReview(mine, reviewTimesOfDay(kinds.filter((k) => k.profileId === p.id)));
    const meal = meals.get(p.id);
    return {
      profileId: p.id,
      displayName: p.displayName,
      colour: p.colour,
      permissions: g.permissions ?? [],
      since: g.createdAt.toISOString(),
      glucoseUnit: p.glucoseUnit,
      carbBasis: p.carbBasis,
      carbUnit: p.carbUnit,
      period: { from: periods[i].from, to: periods[i].to },
      lastMeal: meal
        ? {
            occurredAt: new Date(meal.occurred_at).toISOString(),
            localDate: meal.local_date,
            localTime: minutesToTime(meal.local_minute),
            title: meal.title,
            carbG: p.carbBasis === 'available' ? meal.carb_available_g : meal.carb_total_g,
          }
        : null,
      targetRange: range,
      timeInRange: periodTimeInRange(mine, range),
      review: { mealsInPeriod: review.mealsInPeriod, mealsUsed: review.mealsUsed, minimumMeals: REVIEW_MINIMUM_MEALS, flagLimitMmol: REVIEW_FLAG_CHANGE_MMOL, flags: reviewFlags(review) },
    };
  });
  return { people, invitations, caution: RATIO_REVIEW_CAUTION };
}
