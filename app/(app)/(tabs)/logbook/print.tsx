import { Stack } from 'expo-router';
import { ReviewSheetScreen } from '@/components/logbook/review-sheet-screen';

export default function ReviewSheetRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Review sheet · Carbwright' }} />
      <ReviewSheetScreen />
    </>
  );
}
