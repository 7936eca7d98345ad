import { router, usePathname, type Href } from 'expo-router';
import { TabSlot, TabTrigger, useTabsWithTriggers, type TabTriggerSlotProps } from 'expo-router/ui';
import { forwardRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';
import { useLayout, useTheme } from '../theme/use-theme';
import { useIsClinician } from '../api/clinician-desk';
import { Brand } from './mark';
import { ProfileSwitcher } from './profile-switcher';

/** The five areas in the tab bar; `also` names the pages outside the bar that belong to an area (it stays lit there). */
export const TABS: { name: string; href: Extract<Href, string>; label: string; icon: IconName; also: string[] }[] = [
  { name: 'index', href: '/', label: 'Today', icon: 'today', also: ['dose-check', 'logbook'] },
  { name: 'recipes', href: '/recipes', label: 'Recipes', icon: 'recipes', also: [] },
  { name: 'kitchen', href: '/kitchen', label: 'Kitchen', icon: 'kitchen', also: ['portions', 'batches'] },
  { name: 'plan', href: '/plan', label: 'Plan', icon: 'plan', also: [] },
  { name: 'more', href: '/more', label: 'You', icon: 'more', also: ['settings', 'foods', 'admin', 'invitation', 'confirm-email'] },
];

/** The clinician's desk: a tab only for accounts that support someone as clinician (or hold the clinician role). */
export const DESK_TAB: (typeof TABS)[number] = { name: 'desk', href: '/desk', label: 'Desk', icon: 'desk', also: [] };

/**
 * Pages that live inside the same shell but have no tab of their own (like `href: null` in a tab bar). Each needs a
 * trigger so the tab navigator knows the route; the href only has to reach it.
 */
const HIDDEN = [
  { name: 'dose-check', href: '/dose-check' },
  { name: 'portions/[code]', href: '/portions/-' },
  { name: 'batches/[id]/labels', href: '/batches/0/labels' },
  { name: 'settings', href: '/settings' },
  { name: 'foods', href: '/foods' },
  { name: 'admin', href: '/admin' },
  { name: 'logbook', href: '/logbook' },
  { name: 'invitation', href: '/invitation' },
  { name: 'confirm-email', href: '/confirm-email' },
];

type Triggers = Parameters<typeof useTabsWithTriggers>[0]['triggers'];
const TRIGGERS = [...TABS, DESK_TAB, ...HIDDEN].map(({ name, href }) => ({ type: 'internal', name, href })) as Triggers;

/** Which tab to light for an address: its own, or the area an outside page belongs to. */
export function activeTab(pathname: string): string | undefined {
  const first = pathname.split('/')[1] ?? '';
  if (first === '') return 'index';
  return [...TABS, DESK_TAB].find((tab) => tab.name === first || tab.also.includes(first))?.name;
}

// The label sheet's print styles hide what is marked so; a printed sheet shows labels, not the navigation.
const hideInPrint = { dataSet: { print: 'hide' } } as object;

type TabButtonProps = TabTriggerSlotProps & { label: string; icon: IconName; wide: boolean; active: boolean };

const TabButton = forwardRef<View, TabButtonProps>(function TabButton({ label, icon, wide, active, isFocused: _f, ...props }, ref) {
  const t = useTheme();
  const color = active ? t.colors.primary : t.colors.textMuted;
  return (
    <Pressable
      ref={ref}
      role="tab"
      aria-selected={active}
      aria-label={label}
      {...props}
      style={[wide ? styles.sideButton : styles.bottomButton, active && wide && { backgroundColor: t.colors.primarySoft }]}
    >
      <Icon name={icon} color={color} size={wide ? 22 : 24} />
      <Text variant={wide ? 'label' : 'caption'} weight={active ? 'bold' : 'regular'} style={{ color }}>
        {label}
      </Text>
      {active && !wide ? <View style={[styles.dot, { backgroundColor: t.colors.primary }]} /> : null}
    </Pressable>
  );
});

/**
 * The shell of every signed-in page: a `main` landmark with the page, and a `navigation` landmark holding the
 * tab bar at the bottom on a phone, or the mark, the name and a side rail on a wide screen.
 */
export function AppTabs() {
  const t = useTheme();
  const { isWide } = useLayout();
  const insets = useSafeAreaInsets();
  const pathname = usePathname();
  const current = activeTab(pathname);
  const tabs = useIsClinician() ? [...TABS.slice(0, 1), DESK_TAB, ...TABS.slice(1)] : TABS;
  // Back follows the pages visited (labels → the batch it came from), not the first tab.
  const { NavigationContent } = useTabsWithTriggers({ triggers: TRIGGERS, backBehavior: 'history' });
  return (
    <NavigationContent>
      <View style={[styles.fill, isWide && styles.row]}>
        <View role="main" style={styles.fill}>
          <ProfileSwitcher />
          <TabSlot style={styles.fill} />
        </View>
        <View
          role="navigation"
          aria-label="Main"
          {...hideInPrint}
          style={[
            isWide ? styles.side : styles.bottom,
            { backgroundColor: t.colors.surface, borderColor: t.colors.border },
            !isWide && { paddingBottom: Math.max(insets.bottom, 6) },
          ]}
        >
          {isWide ? (
            <View style={styles.brand}>
              <Brand />
            </View>
          ) : null}
          <View role="tablist" style={isWide ? styles.sideList : styles.bottomList}>
            {tabs.map((tab) => (
              <TabTrigger
                key={tab.name}
                name={tab.name}
                asChild
                onPress={(e) => {
                  // Tapping the tab you are in goes to its first page, also when the page was opened from another tab.
                  if (tab.href === '/' || !pathname.startsWith(`${tab.href}/`)) return;
                  e.preventDefault();
                  router.navigate(tab.href);
                }}
              >
                <TabButton label={tab.label} icon={tab.icon} wide={isWide} active={current === tab.name} />
              </TabTrigger>
            ))}
          </View>
        </View>
      </View>
    </NavigationContent>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  row: { flexDirection: 'row-reverse' },
  bottom: { borderTopWidth: 1, paddingTop: 6 },
  bottomList: { flexDirection: 'row', justifyContent: 'space-around' },
  side: { width: 220, borderRightWidth: 1, paddingHorizontal: 12, paddingTop: 20 },
  sideList: { flexDirection: 'column', gap: 4 },
  brand: { paddingHorizontal: 8, paddingBottom: 20 },
  bottomButton: { flex: 1, alignItems: 'center', justifyContent: 'center', minHeight: 52, gap: 2 },
  sideButton: { flexDirection: 'row', alignItems: 'center', gap: 12, minHeight: 48, paddingHorizontal: 12, borderRadius: 10 },
  dot: { width: 5, height: 5, borderRadius: 3, marginTop: 1 },
});
