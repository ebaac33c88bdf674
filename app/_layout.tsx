// The root: fonts (one subpath per weight, never a package root), the query cache, gestures, safe areas, the
// theme, and the stack of route groups.
import { Inter_400Regular } from '@expo-google-fonts/inter/400Regular';
import { Inter_500Medium } from '@expo-google-fonts/inter/500Medium';
import { Inter_600SemiBold } from '@expo-google-fonts/inter/600SemiBold';
import { Inter_700Bold } from '@expo-google-fonts/inter/700Bold';
import { JetBrainsMono_400Regular } from '@expo-google-fonts/jetbrains-mono/400Regular';
import { JetBrainsMono_500Medium } from '@expo-google-fonts/jetbrains-mono/500Medium';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { DarkTheme, DefaultTheme, Stack, ThemeProvider, type Theme as NavigationTheme } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useEffect, useMemo, useState } from 'react';
import { Platform, View } from 'react-native';
import { GestureHandlerRootView } from 'react-native-gesture-handler';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { fontFamily } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { iconFont } from '@/components/ui/icon';
import { createAppQueryClient } from '@/shared/client/query-client';

export default function RootLayout() {
  const [queryClient] = useState(createAppQueryClient);
  const [fontsLoaded, fontError] = useFonts({
    Inter_400Regular,
    Inter_500Medium,
    Inter_600SemiBold,
    Inter_700Bold,
    JetBrainsMono_400Regular,
    JetBrainsMono_500Medium,
    ...iconFont,
  });
  const theme = useTheme();
  // Browsers fetch a face only when text first uses it; fetch the number faces now so figures never appear
  // in a fallback font first.
  useEffect(() => {
    if (Platform.OS !== 'web' || !fontsLoaded || typeof document === 'undefined' || !document.fonts) return;
    for (const family of [fontFamily.mono, fontFamily.monoMedium]) void document.fonts.load(`16px ${family}`).catch(() => undefined);
  }, [fontsLoaded]);
  const navigationTheme = useMemo<NavigationTheme>(() => {
    const base = theme.scheme === 'dark' ? DarkTheme : DefaultTheme;
    return {
      ...base,
      colors: {
        ...base.colors,
        background: theme.color.ground,
        card: theme.color.surface,
        text: theme.color.ink,
        border: theme.color.line,
        primary: theme.color.primary,
      },
    };
  }, [theme]);

  // A moment of plain ground rather than a flash of fallback fonts; a font that fails to load is not fatal.
  if (!fontsLoaded && !fontError) return <View style={{ flex: 1, backgroundColor: theme.color.ground }} />;

  return (
    <GestureHandlerRootView style={{ flex: 1 }}>
      <SafeAreaProvider>
        <QueryClientProvider client={queryClient}>
          <ThemeProvider value={navigationTheme}>
            <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: theme.color.ground } }}>
              <Stack.Screen name="(app)" />
              <Stack.Screen name="(auth)" />
              <Stack.Screen name="outbox" options={{ title: 'Outbox' }} />
              <Stack.Screen name="+not-found" options={{ title: 'Not found' }} />
            </Stack>
            <StatusBar style={theme.scheme === 'dark' ? 'light' : 'dark'} />
          </ThemeProvider>
        </QueryClientProvider>
      </SafeAreaProvider>
    </GestureHandlerRootView>
  );
}
