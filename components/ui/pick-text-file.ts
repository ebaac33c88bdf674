// Lets the person choose a text file (CSV, JSON) and reads it, in the browser; null when cancelled or where no
// file chooser exists (pasting the text works everywhere).
export interface PickedFile {
  name: string;
  sizeBytes: number;
  text: string;
}

export function canPickFiles(): boolean {
  return typeof document !== 'undefined' && typeof FileReader !== 'undefined';
}

export function pickTextFile(accept: string, maxBytes: number): Promise<PickedFile | { tooLarge: true; name: string; sizeBytes: number } | null> {
  if (!canPickFiles()) return Promise.resolve(null);
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    input.setAttribute('data-testid', 'file-input');
    document.body.appendChild(input);
    const finish = (value: Awaited<ReturnType<typeof pickTextFile>>) => {
      input.remove();
      resolve(value);
    };
    input.addEventListener('change', () => {
      const file = input.files?.[0];
      if (!file) return finish(null);
      // A file too large is refused before it is read into memory.
      if (file.size > maxBytes) return finish({ tooLarge: true, name: file.name, sizeBytes: file.size });
      file.text().then(
        (text) => finish({ name: file.name, sizeBytes: file.size, text }),
        () => finish(null),
      );
    });
    input.addEventListener('cancel', () => finish(null));
    input.click();
  });
}
