import { Stack } from 'expo-router';
import { AuditScreen } from '@/components/admin/audit-screen';

export default function AuditRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Audit · Carbwright' }} />
      <AuditScreen />
    </>
  );
}
