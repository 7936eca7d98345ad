import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useMe, useSignOut } from '../api/auth';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { LinkCard } from '../ui/link-card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';

const ACCESS_WORDS = { owner: 'Your own profile', carer: 'You care for this person', clinician: 'You support this person' } as const;

/** The person's own page: account, profiles they can open, settings and sign-out. */
export function MoreScreen() {
  const me = useMe();
  const signOut = useSignOut();
  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => void me.refetch()} />;
  const { user, profiles } = me.data;
  return (
    <Screen title="You" subtitle={`${user.displayName} · ${user.email}`}>
      <Card>
        <Text variant="heading">Profiles</Text>
        {profiles.length === 0 ? (
          <Text color="textMuted">
            No profile yet. A profile holds one person&apos;s ratios, plans and logs; someone can give you access to theirs.
          </Text>
        ) : (
          profiles.map((p) => (
            <View key={p.id} style={styles.row}>
              <Text weight="bold">{p.displayName}</Text>
              <Text color="textMuted">{ACCESS_WORDS[p.access]}</Text>
            </View>
          ))
        )}
        <TextLink href="/more/new-profile" label="Add a profile for someone you care for" />
      </Card>
      <LinkCard
        title="Logbook"
        description="History of meals, readings and doses, charts, the ratio review, export and the readings import."
        links={[
          { href: '/logbook', label: 'Logbook' },
          { href: '/logbook/review', label: 'Ratio review' },
        ]}
      />
      <LinkCard
        title="People with access"
        description="Invite a carer or a clinician to the profile you are on, see who has access and since when, and revoke it."
        links={[{ href: '/more/people', label: 'People with access' }]}
      />
      <LinkCard
        title="Settings"
        description="Units, safety limits, day kinds with their ratios, and the change history."
        links={[{ href: '/settings', label: 'Settings' }]}
      />
      <LinkCard
        title="Food table"
        description="Search carbohydrate per 100 g and per household measure, or add a food from a package label."
        links={[
          { href: '/foods', label: 'Food table' },
          ...(user.role === 'admin' ? [{ href: '/admin/imports' as const, label: 'Imports' }] : []),
        ]}
      />
      {user.role === 'admin' ? (
        <LinkCard
          title="Admin's desk"
          description="Accounts and roles, the mail outbox, the audit of role changes and access to profiles, and food table imports."
          links={[{ href: '/admin', label: "Admin's desk" }]}
        />
      ) : null}
      <LinkCard
        title="Pots and containers"
        description="Saved pots and containers with their empty weights, used when you cook and portion out a batch."
        links={[{ href: '/kitchen', label: 'Kitchen: containers and batches' }]}
      />
      <Card>
        <Text variant="heading">Account</Text>
        <Text color="textMuted">Role: {user.role}</Text>
        <View style={styles.actions}>
          <Link href="/more/password" asChild>
            <Button variant="secondary" label="Change password" />
          </Link>
          <Link href="/more/email" asChild>
            <Button variant="secondary" label="Change e-mail address" />
          </Link>
          <Button variant="danger" label="Sign out" loading={signOut.isPending} onPress={() => signOut.mutate()} />
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { gap: 2, paddingVertical: 4 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
});
