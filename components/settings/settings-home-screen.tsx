import { useActiveProfile } from '../api/auth';
import { useDayKinds, useProfileSettings } from '../api/profile-settings';
import { Callout } from '../ui/callout';
import { LinkCard } from '../ui/link-card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';

/** Settings: where units and safety limits, day kinds and the change history live. */
export function SettingsHomeScreen() {
  const { profile, isPending: mePending } = useActiveProfile();
  const settings = useProfileSettings(profile?.id);
  const dayKinds = useDayKinds(profile?.id);
  if (mePending || settings.isPending || dayKinds.isPending) return <LoadingState />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => void settings.refetch()} />;
  if (dayKinds.isError) return <ErrorState error={dayKinds.error} onRetry={() => void dayKinds.refetch()} />;
  const ready = !!settings.data.settings && dayKinds.data.length > 0;
  return (
    <Screen title="Settings" subtitle={profile ? `For ${profile.displayName}` : undefined} backHref="/more">
      {ready ? (
        <Callout tone="ok" title="Dose checks are ready">
          Units, safety limits and at least one day kind are set. Change them only as your diabetes team advises.
        </Callout>
      ) : (
        <Callout tone="caution" title="Not set up yet">
          No dose can be suggested until both the units and safety limits and at least one day kind with its ratios are
          filled in. Use the numbers your diabetes team gave you.
        </Callout>
      )}
      <LinkCard
        title="Units and safety limits"
        description={`${settings.data.settings ? 'Set.' : 'Not set yet.'} Glucose and carbohydrate units, pen step, largest single dose, action time, targets and the exercise table.`}
        links={[{ href: '/settings/units', label: 'Units and safety limits' }]}
      />
      <LinkCard
        title="Day kinds and ratios"
        description={`${dayKinds.data.length ? `Yours: ${dayKinds.data.map((k) => k.name).join(', ')}.` : 'None yet.'} Each kind of day holds its insulin-to-carb ratios and correction factors by time of day.`}
        links={[{ href: '/settings/day-kinds', label: 'Day kinds and ratios' }]}
      />
      <LinkCard
        title="Change history"
        description="Who changed what, and when, with the old and new values."
        links={[{ href: '/settings/history', label: 'Change history' }]}
      />
    </Screen>
  );
}
