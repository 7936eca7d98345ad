import { StyleSheet, View } from 'react-native';
import { formatGlucose } from '../../shared/compute/units';
import type { DeskInvitation } from '../../shared/schemas/clinician-desk';
import { useClinicianDesk } from '../api/clinician-desk';
import { dayText } from '../ui/date-format';
import { ProfileDot } from '../nav/profile-switcher';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { DeskPersonCard } from './desk-person-card';

const limitText = (mmol: number) => `${formatGlucose(mmol, 'mmol_l')} (${formatGlucose(mmol, 'mg_dl')})`;
const ROLE_WORDS = { owner: 'owner', carer: 'carer', clinician: 'clinician' } as const;

function Invitations({ items }: { items: DeskInvitation[] }) {
  return (
    <Card>
      <Text variant="heading">Invitations waiting for you</Text>
      <Text color="textMuted">Accept one with the link in the e-mail it came with; the person then appears above.</Text>
      <View role="list" aria-label="Invitations waiting for you" style={styles.list}>
        {items.map((i) => (
          <View key={i.id} role="listitem" style={styles.invitation}>
            <ProfileDot profile={i} />
            <Text>
              {i.inviterName} invited you as {ROLE_WORDS[i.role]} to {i.profileName}&apos;s profile · open until {dayText(i.expiresAt.slice(0, 10))}
            </Text>
          </View>
        ))}
      </View>
    </Card>
  );
}

/**
 * The clinician's desk: everyone whose profile the account holds as clinician, each with the last meal, time in
 * range and the ratio review's flags over the last 14 days, and a way into their logbook; then open invitations.
 */
export function ClinicianDeskScreen() {
  const desk = useClinicianDesk();
  if (desk.isPending) return <LoadingState />;
  if (desk.isError) return <ErrorState error={desk.error} onRetry={() => void desk.refetch()} />;
  const { people, invitations, caution } = desk.data;
  return (
    <Screen title="Clinician's desk" subtitle="The people you support, read from their logbooks over the last 14 days.">
      {people.length === 0 ? (
        <EmptyState title="Nobody on your desk yet">
          When someone invites you as their clinician and you accept the e-mailed link, they appear here.
        </EmptyState>
      ) : (
        <>
          <Callout tone="caution" title="Evidence, not new ratios">
            {`A flag marks a time of day whose glucose, from at least ${people[0].review.minimumMeals} meals, ended on average more than ${limitText(people[0].review.flagLimitMmol)} above or below where it started. ${caution}`}
          </Callout>
          <View role="list" aria-label="People you support" style={styles.list}>
            {people.map((p) => (
              <View key={p.profileId} role="listitem">
                <DeskPersonCard person={p} />
              </View>
            ))}
          </View>
        </>
      )}
      {invitations.length ? <Invitations items={invitations} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: 12 },
  invitation: { flexDirection: 'row', alignItems: 'center', gap: 8, flexWrap: 'wrap' },
});
