// Plain text with every http(s) address in it made into a link (for mail bodies in the outbox).
import { Linking, Platform, Text as RNText } from 'react-native';
import { useTheme } from '../theme/use-theme';
import { Text, type TextProps } from './text';

const URL_PATTERN = /https?:\/\/[^\s<>"')\]]+/g;

export function splitLinks(text: string): { text: string; url?: string }[] {
  const parts: { text: string; url?: string }[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    // A sentence's full stop or comma right after an address is not part of it.
    const url = match[0].replace(/[.,;:!?]+$/, '');
    if (start > last) parts.push({ text: text.slice(last, start) });
    parts.push({ text: url, url });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}

export function MessageText({ text, ...rest }: { text: string } & TextProps) {
  const { color } = useTheme();
  return (
    <Text {...rest}>
      {splitLinks(text).map((part, index) =>
        part.url ? (
          <RNText
            key={index}
            accessibilityRole="link"
            // react-native-web renders a Text with href as a real <a>, so the link opens in the same tab.
            {...(Platform.OS === 'web' ? { href: part.url } : { onPress: () => void Linking.openURL(part.url!) })}
            style={{ color: color.link, textDecorationLine: 'underline' }}
          >
            {part.text}
          </RNText>
        ) : (
          part.text
        ),
      )}
    </Text>
  );
}
