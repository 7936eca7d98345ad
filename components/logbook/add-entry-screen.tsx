import { toLocalTime } from '../../shared/compute/local-time';
import { useActiveProfile } from '../api/auth';
import { useDayKindDays } from '../api/days';
import { useDayKinds } from '../api/profile-settings';
import { Card } from '../ui/card';
import { EmptyState, LoadingState } from '../ui/states';
import { Screen } from '../ui/screen';
import { AddEntryForm } from './add-entry-form';

/** Add an entry: a reading, a dose, exercise or typed carbohydrate, outside the breakfast flow. */
export function AddEntryScreen() {
  const { profile, isPending } = useActiveProfile();
  const timeZone = profile?.timeZone ?? 'UTC';
  const today = toLocalTime(Date.now(), timeZone).localDate;
  const days = useDayKindDays(profile?.id, today, today);
  const kinds = useDayKinds(profile?.id);
  const dayKindId = days.data?.[0]?.dayKindId;
  const dayKind = (kinds.data ?? []).find((k) => (dayKindId != null ? k.id === dayKindId : k.isDefault));

  return (
    <Screen title="Add an entry" subtitle="A glucose reading, a dose, exercise or carbohydrate. Times follow the profile's time zone." backHref="/logbook">
      {isPending ? (
        <LoadingState />
      ) : !profile ? (
        <EmptyState title="No profile yet">Choose or create a profile first.</EmptyState>
      ) : (
        <Card>
          <AddEntryForm
            profileId={profile.id}
            glucoseUnit={profile.glucoseUnit}
            timeZone={timeZone}
            plannedLongUnits={dayKind?.longActingUnits ?? null}
            dayKindName={dayKind?.name}
          />
        </Card>
      )}
    </Screen>
  );
}
