import { Stack } from 'expo-router';
import { AccountsScreen } from '@/components/admin/accounts-screen';

export default function AccountsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Accounts · Carbwright' }} />
      <AccountsScreen />
    </>
  );
}
