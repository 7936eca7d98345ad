import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { ProfileSummary } from '../../shared/schemas/auth';
import { switchProfile, useActiveProfile } from '../api/auth';
import { profileShades } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

const ROLE_WORDS = { owner: 'own profile', carer: 'you care for', clinician: 'you support' } as const;

/** The profile's colour as a dot beside its name, so every page says whose numbers these are. */
export function ProfileDot({ profile }: { profile: Pick<ProfileSummary, 'colour'> }) {
  return <View style={[styles.dot, { backgroundColor: profileShades[profile.colour] }]} />;
}

/**
 * The header line of every signed-in page: whose data this page shows (name and colour of the active profile), and,
 * for someone with several profiles, the switch between them. The choice is kept on this device.
 */
export function ProfileSwitcher() {
  const t = useTheme();
  const { data, profile } = useActiveProfile();
  const [open, setOpen] = useState(false);
  if (!profile || !data) return null;
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
  current: { flexDirection: 'row', alignItems: 'center', gap: 8, minHeight: 44, flexWrap: 'wrap' },
  dot: { width: 14, height: 14, borderRadius: 7 },
  list: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, paddingBottom: 8 },
  option: { flexDirection: 'row', alignItems: 'center', gap: 8, minHeight: 44, paddingHorizontal: 12, borderWidth: 2, borderRadius: 999 },
});
