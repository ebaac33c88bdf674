// Asks the browser for one file (a photo, a CSV or a PDF for a pin). Web only; elsewhere it resolves to null.

/** What a pin takes (the server judges the content again). */
export const PIN_FILE_TYPES = 'image/png,image/jpeg,image/webp,image/gif,application/pdf,text/csv,.csv';
export function pickFile(accept: string): Promise<File | null> {
  if (typeof document === 'undefined') return Promise.resolve(null);
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    input.addEventListener('change', () => {
      resolve(input.files?.[0] ?? null);
      input.remove();
    });
    input.addEventListener('cancel', () => {
      resolve(null);
      input.remove();
    });
    document.body.appendChild(input);
    input.click();
  });
}
