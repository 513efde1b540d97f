import { describe, expect, it } from 'vitest'
import { nextTick, reactive } from 'vue'
import { z } from 'zod'
import { ApiError } from '@/api/http'
import { useFieldErrors } from '@/composables/field-errors'

const schema = z.object({ reason: z.string().min(1, 'Choose why the vehicle was towed.'), vin: z.string().min(1, 'Enter the VIN.'), note: z.string() })

function failedSave(draft: z.input<typeof schema>) {
  const form = useFieldErrors()
  form.follow(() => draft, schema)
  const parsed = schema.safeParse(draft)
  if (!parsed.success) form.fromZod(parsed.error)
  return form
}

// Issue 16: the tow-in form kept "Choose why the vehicle was towed" under a chosen reason until the next save.
describe('field messages that follow the draft', () => {
  it('a schema message goes as soon as its field is right, the others stay', async () => {
    const draft = reactive({ reason: '', vin: '', note: '' })
    const { errors } = failedSave(draft)
    expect(Object.keys(errors).sort()).toEqual(['reason', 'vin'])
    draft.reason = 'abandoned'
    await nextTick()
    expect(errors).toEqual({ vin: 'Enter the VIN.' })
  })

  it('a message does not come back, nor a new one appear, before the next save', async () => {
    const draft = reactive({ reason: '', vin: 'X', note: '' })
    const { errors } = failedSave(draft)
    draft.reason = 'abandoned'
    draft.vin = ''
    await nextTick()
    expect(errors).toEqual({})
  })

  it("the server's message stays while other fields change and goes once its own field changes", async () => {
    const draft = reactive({ reason: 'abandoned', vin: '1G4AH59H45G118341', note: '' })
    const form = useFieldErrors()
    form.follow(() => draft, schema)
    form.fromApi(new ApiError(400, 'Check the fields.', [{ path: 'vin', message: 'That VIN is already on the lot.' }]))
    draft.note = 'keys in the ignition'
    await nextTick()
    expect(form.errors).toEqual({ vin: 'That VIN is already on the lot.' })
    draft.vin = '1M8GDM9AXKP042788'
    await nextTick()
    expect(form.errors).toEqual({})
  })

  it('without following, messages stay until cleared (a form that never opted in)', async () => {
    const draft = reactive({ reason: '', vin: '', note: '' })
    const form = useFieldErrors()
    const parsed = schema.safeParse(draft)
    if (!parsed.success) form.fromZod(parsed.error)
    draft.reason = 'abandoned'
    await nextTick()
    expect(Object.keys(form.errors).sort()).toEqual(['reason', 'vin'])
  })
})
