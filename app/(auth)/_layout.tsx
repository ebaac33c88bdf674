// Signed-out screens: a plain stack without headers; each screen brings its own frame.
import { Stack } from 'expo-router';
import { useTheme } from '@/components/theme/use-theme';

export default function AuthLayout() {
  const { color } = useTheme();
  return <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: color.ground } }} />;
}
