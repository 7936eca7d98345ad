import type { Includeable } from 'sequelize';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import { glucoseFromMmol } from '../../shared/compute/units';
import type { GlucoseUnit } from '../../shared/schemas/units';
import type { LogEntry } from '../../shared/schemas/logbook';
import type { ExerciseIntensity } from '../../shared/compute/exercise';
import { DayKindModel, PortionModel, UserModel, type LogEntryModel } from '../models';

/** The includes `toLogEntry` reads: who entered it, its day kind's name and its portion's code. */
export const LOG_ENTRY_INCLUDE: Includeable[] = [
  { model: UserModel, as: 'enteredBy', attributes: ['id', 'displayName'] },
  { model: DayKindModel, as: 'dayKind', attributes: ['id', 'name'] },
  { model: PortionModel, as: 'portion', attributes: ['id', 'code'] },
];

/**
 * A plain row read with LOG_ENTRY_INCLUDE (`raw: true, nest: true`) answers a missing include as an object of nulls;
 * this turns those back into null, as a model instance has them.
 */
export function plainIncludes<T extends LogEntryModel>(row: T): T {
  const present = <I extends { id: number } | null | undefined>(inc: I) => (inc && inc.id != null ? inc : null);
  return Object.assign(row, { enteredBy: present(row.enteredBy), dayKind: present(row.dayKind), portion: present(row.portion) });
}

/** One stored entry (loaded with LOG_ENTRY_INCLUDE) as the API answers it, glucose in the profile's unit. */
export function toLogEntry(row: LogEntryModel, glucoseUnit: GlucoseUnit, changed = false): LogEntry {
  const isDose = row.kind === 'rapid_dose' || row.kind === 'long_dose';
  return {
    id: row.id,
    profileId: row.profileId,
    kind: row.kind,
    occurredAt: row.occurredAt.toISOString(),
    localDate: row.localDate,
    localTime: minutesToTime(row.localMinute),
    timeZone: row.timeZone,
    dayKindId: row.dayKindId,
    dayKindName: row.dayKind?.name ?? null,
    groupKey: row.groupKey,
    enteredBy: row.enteredBy ? { id: row.enteredBy.id, name: row.enteredBy.displayName } : null,
    meal:
      row.kind === 'meal'
        ? {
            source: row.mealSource ?? 'typed',
            portionCode: row.portion?.code ?? null,
            recipeId: row.recipeId,
            foodId: row.foodId,
            title: row.title ?? '',
            grams: row.grams,
            plateTareGrams: row.plateTareGrams,
            carbAvailableG: row.carbAvailableG,
            carbTotalG: row.carbTotalG,
            planMealId: row.planMealId,
          }
        : null,
    reading:
      row.kind === 'reading' && row.glucoseMmol != null
        ? { glucose: glucoseFromMmol(row.glucoseMmol, glucoseUnit), source: row.readingSource ?? 'typed' }
        : null,
    dose: isDose && row.units != null ? { units: row.units, suggestion: row.suggestion, plannedUnits: row.plannedUnits } : null,
    exercise:
      row.kind === 'exercise' && row.intensity && row.durationMinutes != null
        ? { intensity: row.intensity as ExerciseIntensity, durationMinutes: row.durationMinutes }
        : null,
    note: row.note,
    changed,
    deleted: row.deletedAt != null,
    createdAt: row.createdAt.toISOString(),
  };
}
