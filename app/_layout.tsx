import { Lora_400Regular } from '@expo-google-fonts/lora/400Regular';
import { Lora_600SemiBold } from '@expo-google-fonts/lora/600SemiBold';
import { Lora_700Bold } from '@expo-google-fonts/lora/700Bold';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Stack } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useEffect, useState } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { withOfflineCopy } from '@/components/api/offline-copy';
import { createQueryClient } from '@/components/api/query-client';
import { SessionProvider } from '@/components/auth/session';
import { registerServiceWorker } from '@/components/offline/service-worker';
import { palette } from '@/components/theme/tokens';

export { ErrorBoundary } from 'expo-router';

export default function RootLayout() {
  const [queryClient] = useState(() => withOfflineCopy(createQueryClient()));
  useEffect(registerServiceWorker, []);
  const [fontsLoaded, fontError] = useFonts({ Lora_400Regular, Lora_600SemiBold, Lora_700Bold });
  if (!fontsLoaded && !fontError) return null;
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <SessionProvider>
          <StatusBar style="dark" />
          <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: palette.background } }} />
        </SessionProvider>
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
