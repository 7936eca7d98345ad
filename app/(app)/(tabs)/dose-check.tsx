import { Stack, useLocalSearchParams } from 'expo-router';
import { DoseCheckScreen } from '@/components/dose/dose-check-screen';

export default function DoseCheckRoute() {
  const { carbs, portion, label } = useLocalSearchParams<{ carbs?: string; portion?: string; label?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Check a dose · Carbwright' }} />
      <DoseCheckScreen carbs={carbs} portion={portion} label={label} />
    </>
  );
}
