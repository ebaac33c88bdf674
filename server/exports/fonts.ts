// The font files shipped in assets/fonts (SIL Open Font License, beside them), for the server's PNG and PDF.
import path from 'node:path';

const dir = path.resolve(__dirname, '../../assets/fonts');

export const FONT_FILES = {
  text: path.join(dir, 'Inter_400Regular.ttf'),
  textBold: path.join(dir, 'Inter_600SemiBold.ttf'),
  mono: path.join(dir, 'JetBrainsMono_400Regular.ttf'),
} as const;
