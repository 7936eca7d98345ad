import { Stack, useLocalSearchParams } from 'expo-router';
import { DoseCheckScreen } from '@/components/dose/dose-check-screen';

export default function DoseCheckRoute() {
  const { carbs, portion, label, log, plan } = useLocalSearchParams<{ carbs?: string; portion?: string; label?: string; log?: string; plan?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: `${log ? 'Log a meal' : 'Check a dose'} · Carbwright` }} />
      <DoseCheckScreen carbs={carbs} portion={portion} label={label} log={log} plan={plan} />
    </>
  );
}
