import { Stack, useLocalSearchParams } from 'expo-router';
import { LabelSheetScreen } from '@/components/kitchen/label-sheet-screen';

export default function LabelsRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Labels · Carbwright' }} />
      <LabelSheetScreen id={Number(id)} />
    </>
  );
}
