import { Lora_400Regular } from '@expo-google-fonts/lora/400Regular';
import { Lora_600SemiBold } from '@expo-google-fonts/lora/600SemiBold';
import { Lora_700Bold } from '@expo-google-fonts/lora/700Bold';
import { QueryClientProvider } from '@tanstack/react-query';
import { FontDisplay, useFonts } from 'expo-font';
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

// The Lora weights load beside the first paint, not before it: text shows at once in the browser's fallback serif
// and swaps to Lora when it arrives (font-display: swap), so a slow font no longer holds back the whole screen.
const FONTS = {
  Lora_400Regular: { uri: Lora_400Regular, display: FontDisplay.SWAP },
  Lora_600SemiBold: { uri: Lora_600SemiBold, display: FontDisplay.SWAP },
  Lora_700Bold: { uri: Lora_700Bold, display: FontDisplay.SWAP },
};

export default function RootLayout() {
  const [queryClient] = useState(() => withOfflineCopy(createQueryClient()));
  useEffect(registerServiceWorker, []);
  useFonts(FONTS);
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
