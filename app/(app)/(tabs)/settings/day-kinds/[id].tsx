import { Stack, useLocalSearchParams } from 'expo-router';
import { DayKindEditorScreen } from '@/components/settings/day-kind-editor-screen';

export default function DayKindEditorRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Day kind · Carbwright' }} />
      <DayKindEditorScreen id={id ?? 'new'} />
    </>
  );
}
