import { AppError, type said } from '../errors'

/**
 * A refusal about one field: the sentence, its code for the reader's language (`said(…)`, required so no
 * refusal leaves without one), and the field's issue repeating the sentence, which reads as the refusal does.
 */
export const refusal = (status: number, path: string, message: string, words: ReturnType<typeof said>) => new AppError(status, message, { ...words, issues: [{ path, message }] })
