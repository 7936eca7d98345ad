import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { ProfileSummary } from '../../shared/schemas/auth';
import { authKeys, switchProfile, useActiveProfile } from '../api/auth';
import { setProfileMissingHandler } from '../api/client';
import { useActiveProfileId } from '../auth/active-profile-store';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { profileShades } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

const ROLE_WORDS = { owner: 'own profile', carer: 'you care for', clinician: 'you support' } as const;

/** The profile's colour as a dot beside its name, so every page says whose numbers these are. */
export function ProfileDot({ profile }: { profile: Pick<ProfileSummary, 'colour'> }) {
  return <View style={[styles.dot, { backgroundColor: profileShades[profile.colour] }]} />;
}

/**
 * When the profile this device had open answers 404 (its access was revoked), the profile list is fetched again, so
 * the switch drops it; this says so, naming it, until dismissed. After a reload it is simply no longer listed (a
 * profile id kept on this device from another account must not raise the notice).
 */
function useLostProfile() {
  const queryClient = useQueryClient();
  const { data, profile } = useActiveProfile();
  const chosen = useActiveProfileId();
  const seen = useRef(new Map<number, string>());
  for (const p of data?.profiles ?? []) seen.current.set(p.id, p.displayName);
  useEffect(() => {
    setProfileMissingHandler((id) => {
      if (id === profile?.id) void queryClient.invalidateQueries({ queryKey: authKeys.me() });
    });
    return () => setProfileMissingHandler(undefined);
  }, [profile?.id, queryClient]);
  const name = chosen !== null && data && !data.profiles.some((p) => p.id === chosen) ? seen.current.get(chosen) : undefined;
  return name ? { name } : null;
}

function LostProfileNotice({ name, showing }: { name: string; showing?: ProfileSummary }) {
  return (
    <View role="status" style={styles.notice}>
      <Callout tone="caution" title="No longer open to you">
        {`${name}'s profile is no longer shared with you.${showing ? ` Showing ${showing.displayName}'s data.` : ''}`}
      </Callout>
      {showing ? <Button variant="secondary" label="OK" onPress={() => switchProfile(showing.id)} /> : null}
    </View>
  );
}

/**
 * The header line of every signed-in page: whose data this page shows (name and colour of the active profile), and,
 * for someone with several profiles, the switch between them. The choice is kept on this device.
 */
export function ProfileSwitcher() {
  const t = useTheme();
  const { data, profile } = useActiveProfile();
  const lost = useLostProfile();
  const [open, setOpen] = useState(false);
  if (!profile || !data) return lost ? <LostProfileNotice name={lost.name} /> : null;
  const many = data.profiles.length > 1;
  const role = `${ROLE_WORDS[profile.access]}${many ? (open ? ' · close' : ' · switch') : ''}`;
  // The name starts with the words on the button (WCAG 2.5.3, label in name), then says what it is for.
  const label = `${profile.displayName}, ${role}. Showing ${profile.displayName}'s data${many ? '; switch profile' : ''}`;
  return (
    <View style={[styles.bar, { borderColor: t.colors.border, backgroundColor: t.colors.surface }]} {...({ dataSet: { print: 'hide' } } as object)}>
      <Pressable
        role="button"
        aria-label={label}
        aria-expanded={many ? open : undefined}
        disabled={!many}
        onPress={() => setOpen((o) => !o)}
        style={styles.current}
        testID="active-profile"
      >
        <ProfileDot profile={profile} />
        <Text weight="bold" style={{ color: profileShades[profile.colour] }}>
          {profile.displayName}
        </Text>
        <Text variant="caption" color="textMuted">
          {role}
        </Text>
      </Pressable>
      {lost ? <LostProfileNotice name={lost.name} showing={profile} /> : null}
      {open ? (
        <View role="radiogroup" aria-label="Profiles" style={styles.list}>
          {data.profiles.map((p) => (
            <Pressable
              key={p.id}
              role="radio"
              aria-checked={p.id === profile.id}
              onPress={() => {
                switchProfile(p.id);
                setOpen(false);
              }}
              style={[styles.option, { borderColor: p.id === profile.id ? profileShades[p.colour] : t.colors.border }]}
            >
              <ProfileDot profile={p} />
              <Text>{p.displayName}</Text>
              <Text variant="caption" color="textMuted">
                {ROLE_WORDS[p.access]}
              </Text>
            </Pressable>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { borderBottomWidth: 1, paddingHorizontal: 16, paddingVertical: 2 },
  current: { flexDirection: 'row', alignItems: 'center', alignContent: 'center', gap: 8, minHeight: 44, flexWrap: 'wrap' },
  dot: { width: 14, height: 14, borderRadius: 7 },
  notice: { gap: 8, paddingBottom: 8, alignItems: 'flex-start' },
  list: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, paddingBottom: 8 },
  option: { flexDirection: 'row', alignItems: 'center', gap: 8, minHeight: 44, paddingHorizontal: 12, borderWidth: 2, borderRadius: 999 },
});
