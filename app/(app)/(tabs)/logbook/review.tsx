import { Stack } from 'expo-router';
import { ReviewScreen } from '@/components/logbook/review-screen';

export default function RatioReviewRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Ratio review · Carbwright' }} />
      <ReviewScreen />
    </>
  );
}
