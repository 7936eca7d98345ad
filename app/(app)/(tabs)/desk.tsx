import { Stack } from 'expo-router';
import { ClinicianDeskScreen } from '@/components/desk/clinician-desk-screen';

export default function DeskRoute() {
  return (
    <>
      <Stack.Screen options={{ title: "Clinician's desk · Carbwright" }} />
      <ClinicianDeskScreen />
    </>
  );
}
