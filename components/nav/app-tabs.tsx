import { router, usePathname, type Href } from 'expo-router';
import { TabList, TabSlot, TabTrigger, Tabs, type TabTriggerSlotProps } from 'expo-router/ui';
import { forwardRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';
import { useLayout, useTheme } from '../theme/use-theme';

export const TABS: { name: string; href: Extract<Href, string>; label: string; icon: IconName }[] = [
  { name: 'index', href: '/', label: 'Today', icon: 'today' },
  { name: 'recipes', href: '/recipes', label: 'Recipes', icon: 'recipes' },
  { name: 'kitchen', href: '/kitchen', label: 'Kitchen', icon: 'kitchen' },
  { name: 'plan', href: '/plan', label: 'Plan', icon: 'plan' },
  { name: 'more', href: '/more', label: 'You', icon: 'more' },
];

type TabButtonProps = TabTriggerSlotProps & { label: string; icon: IconName; wide: boolean };

const TabButton = forwardRef<View, TabButtonProps>(function TabButton({ label, icon, wide, isFocused, ...props }, ref) {
  const t = useTheme();
  const color = isFocused ? t.colors.primary : t.colors.textMuted;
  return (
    <Pressable
      ref={ref}
      role="tab"
      aria-selected={!!isFocused}
      aria-label={label}
      {...props}
      style={[
        wide ? styles.sideButton : styles.bottomButton,
        isFocused && wide && { backgroundColor: t.colors.primarySoft },
      ]}
    >
      <Icon name={icon} color={color} size={wide ? 22 : 24} />
      <Text variant={wide ? 'label' : 'caption'} weight={isFocused ? 'bold' : 'regular'} style={{ color }}>
        {label}
      </Text>
      {isFocused && !wide ? <View style={[styles.dot, { backgroundColor: t.colors.primary }]} /> : null}
    </Pressable>
  );
});

/** Tab bar at the bottom on a phone; a side rail with the name on a wide screen. */
export function AppTabs() {
  const t = useTheme();
  const { isWide } = useLayout();
  const insets = useSafeAreaInsets();
  const pathname = usePathname();
  return (
    <Tabs style={[styles.fill, isWide && styles.row]}>
      <TabSlot style={styles.fill} />
      <TabList
        role="tablist"
        style={[
          isWide ? styles.side : styles.bottom,
          { backgroundColor: t.colors.surface, borderColor: t.colors.border },
          !isWide && { paddingBottom: Math.max(insets.bottom, 6) },
        ]}
      >
        {isWide ? (
          <View style={styles.brand}>
            <Text variant="heading" color="primary">
              Carbwright
            </Text>
          </View>
        ) : null}
        {TABS.map((tab) => (
          <TabTrigger
            key={tab.name}
            name={tab.name}
            href={tab.href}
            asChild
            onPress={(e) => {
              // Tapping the tab you are in goes to its first page, also when the page was opened from another tab.
              if (tab.href === '/' || !pathname.startsWith(`${tab.href}/`)) return;
              e.preventDefault();
              router.navigate(tab.href);
            }}
          >
            <TabButton label={tab.label} icon={tab.icon} wide={isWide} />
          </TabTrigger>
        ))}
      </TabList>
    </Tabs>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  row: { flexDirection: 'row-reverse' },
  bottom: { flexDirection: 'row', justifyContent: 'space-around', borderTopWidth: 1, paddingTop: 6 },
  side: { width: 220, flexDirection: 'column', justifyContent: 'flex-start', borderRightWidth: 1, paddingHorizontal: 12, paddingTop: 20, gap: 4 },
  brand: { paddingHorizontal: 12, paddingBottom: 20 },
  bottomButton: { flex: 1, alignItems: 'center', justifyContent: 'center', minHeight: 52, gap: 2 },
  sideButton: { flexDirection: 'row', alignItems: 'center', gap: 12, minHeight: 48, paddingHorizontal: 12, borderRadius: 10 },
  dot: { width: 5, height: 5, borderRadius: 3, marginTop: 1 },
});
