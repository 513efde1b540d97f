import type { FieldCode, FieldParams } from '@shared/schemas/field-messages'

/**
 * Why one uploaded file is refused: its English (after the file's name) and its code under `fields.files`
 * with the parameters beside it; the file's name is added as `name` when the issue is made.
 */
export interface FileRefusal {
  code: FieldCode
  message: string
  params?: FieldParams
}
