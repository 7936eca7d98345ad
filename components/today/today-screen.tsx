import { Link } from 'expo-router';
import { useMe } from '../api/auth';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { EmptyState } from '../ui/states';

function todayLabel(now: Date) {
  return now.toLocaleDateString(undefined, { weekday: 'long', day: 'numeric', month: 'long' });
}

/** Today: the day's kind, planned meals and logging. */
export function TodayScreen() {
  const me = useMe();
  const name = me.data?.user.displayName;
  return (
    <Screen title={name ? `Good to see you, ${name}` : 'Today'} subtitle={todayLabel(new Date())}>
      <Link href="/dose-check" asChild>
        <Button label="Check a dose" size="lg" />
      </Link>
      <EmptyState title="Nothing planned for today yet">
        Once you cook a batch and plan the week, today&apos;s meals appear here with their carbohydrate, and you can
        check a dose and log what you ate and injected.
      </EmptyState>
    </Screen>
  );
}
