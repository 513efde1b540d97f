/** Letters go out in the recipient's language (DESIGN.md, "Languages"); every document's words live beside these. */
export type Language = 'en' | 'es'

export const COMMON_WORDS = {
  en: {
    page: (n: number, of: number) => `Page ${n} of ${of}`,
    cautionTitle: 'Check the rules where you are',
    // Holdfast's own wording of the caution every legal document carries (DESIGN.md, "Documents").
    caution:
      'Towing, storage, notice and lien-sale rules are set by each state and often by the city or county too, and they change. ' +
      'This document follows the rule set this yard chose. Before relying on it, confirm each requirement against the local code and with your own legal counsel.',
    total: 'Total',
    phone: 'Phone',
  },
  es: {
    page: (n: number, of: number) => `Página ${n} de ${of}`,
    cautionTitle: 'Verifique las normas de su lugar',
    caution:
      'Las normas sobre remolque, almacenaje, avisos y ventas por gravamen las fija cada estado y a menudo también la ciudad o el condado, y cambian con el tiempo. ' +
      'Este documento sigue el conjunto de reglas que eligió este depósito. Antes de confiar en él, confirme cada requisito con el código local y con su propio asesor legal.',
    total: 'Total',
    phone: 'Teléfono',
  },
} satisfies Record<Language, Record<string, unknown>>
