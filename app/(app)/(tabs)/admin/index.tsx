import { Stack } from 'expo-router';
import { AdminIndexScreen } from '@/components/admin/admin-index-screen';

export default function AdminIndexRoute() {
  return (
    <>
      <Stack.Screen options={{ title: "Admin's desk · Carbwright" }} />
      <AdminIndexScreen />
    </>
  );
}
