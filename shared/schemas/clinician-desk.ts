import { z } from 'zod';
import { grantPermissionSchema, profileAccessRoleSchema, profileColourSchema } from './auth';
import { carbBasisSchema, carbUnitSchema, glucoseUnitSchema } from './units';

/** The clinician's desk: the people a clinician supports, each read by the logbook's own History and review rules. */

/** How many local days (up to today, in each person's time zone) the desk reads: the same 14 as History's default. */
export const DESK_DAYS = 14;

const timeInRangeSchema = z.object({
  readings: z.number().int(),
  belowPercent: z.number().nullable(),
  inPercent: z.number().nullable(),
  abovePercent: z.number().nullable(),
});

const reviewFlagSchema = z.object({
  dayKindId: z.number().int().nullable(),
  dayKindName: z.string().nullable(),
  startMinute: z.number().int().nullable(),
  endMinute: z.number().int().nullable(),
  direction: z.enum(['rose', 'fell']),
  meals: z.number().int(),
  averageChangeMmol: z.number(),
});

export const deskPersonSchema = z.object({
  profileId: z.number().int(),
  displayName: z.string(),
  colour: profileColourSchema,
  /** This clinician's extra permissions on the profile (`ratios`: may change kinds of day and ratios). */
  permissions: z.array(grantPermissionSchema),
  since: z.string(),
  glucoseUnit: glucoseUnitSchema,
  carbBasis: carbBasisSchema,
  carbUnit: carbUnitSchema,
  /** The local dates read (the profile's time zone), from..to inclusive. */
  period: z.object({ from: z.string(), to: z.string() }),
  /** The latest meal logged (any date), carbohydrate in grams of the profile's basis (null when unknown). */
  lastMeal: z.object({ occurredAt: z.string(), localDate: z.string(), localTime: z.string(), title: z.string().nullable(), carbG: z.number().nullable() }).nullable(),
  /** As History's charts: readings against the profile's target range (mmol/L). */
  targetRange: z.object({ lowMmol: z.number(), highMmol: z.number(), fromProfile: z.boolean() }),
  timeInRange: timeInRangeSchema,
  /** As the ratio review: meals in the period, meals used, and the figures beyond ±flagLimitMmol. */
  review: z.object({ mealsInPeriod: z.number().int(), mealsUsed: z.number().int(), minimumMeals: z.number().int(), flagLimitMmol: z.number(), flags: z.array(reviewFlagSchema) }),
});
export type DeskPerson = z.infer<typeof deskPersonSchema>;

/** An invitation addressed to the clinician's own e-mail and not yet accepted (accepted through the e-mailed link). */
export const deskInvitationSchema = z.object({
  id: z.number().int(),
  profileName: z.string(),
  colour: profileColourSchema,
  inviterName: z.string(),
  role: profileAccessRoleSchema,
  permissions: z.array(grantPermissionSchema),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type DeskInvitation = z.infer<typeof deskInvitationSchema>;

/** GET /api/clinician-desk */
export const clinicianDeskSchema = z.object({
  people: z.array(deskPersonSchema),
  invitations: z.array(deskInvitationSchema),
  caution: z.string(),
});
export type ClinicianDesk = z.infer<typeof clinicianDeskSchema>;

/** POST /api/recipes/:id/offers-to-my-people: how many people were offered the recipe. */
export const peopleOfferResultSchema = z.object({ status: z.literal('offered'), people: z.number().int() });
export type PeopleOfferResult = z.infer<typeof peopleOfferResultSchema>;
