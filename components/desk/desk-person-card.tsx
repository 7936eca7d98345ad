import { router, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatCarb, formatGlucose } from '../../shared/compute/units';
import type { DeskPerson } from '../../shared/schemas/clinician-desk';
import { switchProfile } from '../api/auth';
import { dayText } from '../ui/date-format';
import { glucoseChangeText, minutesRange, percentText } from '../logbook/log-format';
import { ProfileDot } from '../nav/profile-switcher';
import { profileShades } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';

/** Makes the person's profile the active one (as the header's switch does), then opens one of their pages. */
function openAs(profileId: number, href: Href) {
  switchProfile(profileId);
  router.push(href);
}

function lastMealText(p: DeskPerson): string {
  if (!p.lastMeal) return 'No meal logged yet';
  const m = p.lastMeal;
  return `${dayText(m.localDate)} ${m.localTime} · ${m.title || 'Meal'} · ${formatCarb(m.carbG, p.carbUnit)}`;
}

function rangeText(p: DeskPerson): string {
  const tir = p.timeInRange;
  if (!tir.readings) return 'No readings in these days';
  const range = `${formatGlucose(p.targetRange.lowMmol, p.glucoseUnit)}–${formatGlucose(p.targetRange.highMmol, p.glucoseUnit)}`;
  return `${percentText(tir.inPercent)} in range, ${percentText(tir.belowPercent)} below, ${percentText(tir.abovePercent)} above · ${tir.readings} readings (target ${range}${p.targetRange.fromProfile ? '' : ', the consensus range'})`;
}

/** One person on the clinician's desk: whose, last meal, time in range, review flags, and the way into their pages. */
export function DeskPersonCard({ person: p }: { person: DeskPerson }) {
  const flags = p.review.flags;
  return (
    <Card aria-label={p.displayName}>
      <View style={styles.head}>
        <ProfileDot profile={p} />
        <Text variant="heading" style={{ color: profileShades[p.colour] }}>
          {p.displayName}
        </Text>
        <Text variant="caption" color="textMuted">
          {p.permissions.includes('ratios') ? 'You may change kinds of day and ratios' : 'You read only'}
        </Text>
      </View>
      <View style={styles.facts}>
        <View style={styles.fact}>
          <Text variant="label" color="textMuted">
            Last meal
          </Text>
          <Text>{lastMealText(p)}</Text>
        </View>
        <View style={styles.fact}>
          <Text variant="label" color="textMuted">
            Time in range, {dayText(p.period.from)} – {dayText(p.period.to)}
          </Text>
          <Text>{rangeText(p)}</Text>
        </View>
      </View>
      <View style={styles.flags}>
        <Text variant="label" color="textMuted">
          Ratio review flags
        </Text>
        {flags.length === 0 ? (
          <Text>
            None: no time of day with at least {p.review.minimumMeals} usable meals moved beyond ±{formatGlucose(p.review.flagLimitMmol, p.glucoseUnit)} on average ({p.review.mealsUsed} of{' '}
            {p.review.mealsInPeriod} meals usable).
          </Text>
        ) : (
          <View role="list" aria-label={`Ratio review flags for ${p.displayName}`}>
            {flags.map((f) => (
              <Text key={`${f.dayKindId}-${f.startMinute}`} role="listitem" color="caution">
                {f.dayKindName ?? 'No day kind'} · {minutesRange(f.startMinute, f.endMinute)}: glucose {f.direction} {glucoseChangeText(f.averageChangeMmol, p.glucoseUnit)} on
                average after {f.meals} meals
              </Text>
            ))}
          </View>
        )}
      </View>
      <View style={styles.actions}>
        <Button label={`Open ${p.displayName}'s logbook`} onPress={() => openAs(p.profileId, '/logbook')} />
        <Button variant="secondary" label="Ratio review" aria-label={`${p.displayName}'s ratio review`} onPress={() => openAs(p.profileId, { pathname: '/logbook/review', params: p.period })} />
        <Button variant="secondary" label="Day kinds" aria-label={`${p.displayName}'s day kinds`} onPress={() => openAs(p.profileId, '/settings/day-kinds')} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: 8, flexWrap: 'wrap' },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: 16 },
  // flexBasis only inside the row of facts; in the card's column it would be a height.
  fact: { gap: 2, flexGrow: 1, flexBasis: 280, minWidth: 0 },
  flags: { gap: 2 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
