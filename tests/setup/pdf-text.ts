import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** Each page's text, with runs of whitespace (including line breaks) as single spaces. */
export async function pageTexts(pdf: Buffer): Promise<string[]> {
  const document = await getDocument({
    data: new Uint8Array(pdf),
    isEvalSupported: false,
    useSystemFonts: false,
    disableFontFace: true,
  }).promise;
  const pages: string[] = [];
  for (let number = 1; number <= document.numPages; number++) {
    const content = await (await document.getPage(number)).getTextContent();
    const text = content.items
      .map((item) => ('str' in item ? `${item.str}${item.hasEOL ? '\n' : ''}` : ''))
      .join('');
    pages.push(text.replace(/\s+/g, ' '));
  }
  await document.destroy();
  return pages;
}
