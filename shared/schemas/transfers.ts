import { z } from 'zod'
import { ID_TYPES } from './releases'
import { alongsideFieldIssues, optionalText, requiredText, text } from './fields'
import { lienSaleGateSchema } from './charges'
import { msg } from './field-messages'

/**
 * A title transfer (issue 11): the owner signs the vehicle over to the yard or a salvage buyer
 * (`signed_over`, closing as "title transferred"), or the yard sells it under its lien (`lien_sale`).
 */
export const TRANSFER_KINDS = ['signed_over', 'lien_sale'] as const
export type TransferKind = (typeof TRANSFER_KINDS)[number]

/** Who takes the title: the yard itself, a salvage buyer, or anyone else (a bidder at the sale). */
export const BUYER_KINDS = ['yard', 'salvage_buyer', 'other'] as const
export type BuyerKind = (typeof BUYER_KINDS)[number]

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/
/** A hundred million dollars: more than any vehicle a yard sells, less than cents can overflow. */
export const MAX_PRICE_CENTS = 10_000_000_000

export const transferInputSchema = z
  .object({
    kind: z.enum(TRANSFER_KINDS, { error: msg('transfers.chooseSignOverLien', 'Choose a sign-over or a lien sale.') }),
    sellerName: requiredText(120, msg('transfers.enterSellerOwnerSigning', 'Enter the seller: the owner signing it over, or the yard selling under its lien.')),
    buyerKind: z.enum(BUYER_KINDS, { error: msg('transfers.chooseWhoBuys', 'Choose who buys it.') }),
    buyerName: requiredText(120, msg('transfers.enterBuyer', 'Enter the buyer.')),
    buyerAddress: requiredText(240, msg('transfers.enterBuyerAddress', "Enter the buyer's address.")),
    buyerIdType: z.enum(ID_TYPES, { error: msg('transfers.chooseKindIdBuyer', 'Choose the kind of ID the buyer showed.') }).nullish().transform((v) => v ?? null),
    buyerIdNumber: optionalText(40),
    priceCents: z
      .number({ error: msg('transfers.enterPrice', 'Enter the price.') })
      .int(msg('transfers.enterPriceWholeCents', 'Enter the price in whole cents.'))
      .min(0, msg('transfers.priceCannotNegative', 'The price cannot be negative.'))
      .max(MAX_PRICE_CENTS, msg('transfers.priceTooLarge', 'The price is too large.')),
    date: text({ error: msg('transfers.enterDateSale', 'Enter the date of the sale.') }).regex(ISO_DAY, msg('transfers.enterDateSale', 'Enter the date of the sale.')),
    odometer: z.number({ error: msg('transfers.enterOdometerAsNumber', 'Enter the odometer as a number.') }).int(msg('transfers.enterOdometerWholeMiles', 'Enter the odometer in whole miles.')).min(0, msg('transfers.odometerCannotNegative', 'The odometer cannot be negative.')).max(2_000_000, msg('transfers.odometerReadingTooLarge', 'The odometer reading is too large.')).nullish().transform((v) => v ?? null),
    odometerUnreadable: z.boolean().default(false),
    /** The GVWR in pounds when known (49 CFR 580.17(a)(1)); unknown is treated as not exempt by weight. */
    gvwrLb: z.number({ error: msg('transfers.enterGvwrPounds', 'Enter the GVWR in pounds.') }).int(msg('transfers.enterGvwrWholePounds', 'Enter the GVWR in whole pounds.')).min(1, msg('transfers.enterGvwrPounds', 'Enter the GVWR in pounds.')).max(200_000, msg('transfers.gvwrTooLarge', 'The GVWR is too large.')).nullish().transform((v) => v ?? null),
    selfPropelled: z.boolean().default(true),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'signed_over' && v.buyerKind === 'other') {
      ctx.addIssue({ code: 'custom', path: ['buyerKind'], message: msg('transfers.vehicleSignedOverYard', 'A vehicle is signed over to the yard or a salvage buyer; a sale to anyone else is a lien sale.') })
    }
    // Anyone but the yard itself shows an ID: the buyer's name and ID go on the bill of sale.
    if (v.buyerKind !== 'yard' && v.buyerKind !== undefined) {
      if (!v.buyerIdType) ctx.addIssue({ code: 'custom', path: ['buyerIdType'], message: msg('transfers.chooseKindIdBuyer', 'Choose the kind of ID the buyer showed.') })
      if (!v.buyerIdNumber) ctx.addIssue({ code: 'custom', path: ['buyerIdNumber'], message: msg('transfers.enterBuyerIdNumber', "Enter the buyer's ID number.") })
    }
  }, alongsideFieldIssues)
export type TransferInput = z.input<typeof transferInputSchema>

/** 49 CFR 580.17 for this transfer: whether the packet carries an odometer statement, and why. */
export const odometerDecisionSchema = z.object({ required: z.boolean(), clause: z.string(), reason: z.string() })

/** How a lien sale's price was applied: charges first, any surplus is the owner's. */
export const proceedsSchema = z.object({
  /** What was owed on the day of the sale (charges less payments and approved credits). */
  dueCents: z.number(),
  /** Paid from the proceeds toward the charges. */
  appliedCents: z.number(),
  /** Left over after the charges: owed to the owner (or as the law directs), never the yard's. */
  surplusCents: z.number(),
  /** Charges the price did not cover. */
  shortfallCents: z.number(),
})
export type Proceeds = z.infer<typeof proceedsSchema>

export const transferRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(TRANSFER_KINDS),
  sellerName: z.string(),
  buyerKind: z.enum(BUYER_KINDS),
  buyerName: z.string(),
  buyerAddress: z.string(),
  buyerIdType: z.enum(ID_TYPES).nullable(),
  buyerIdNumber: z.string().nullable(),
  priceCents: z.number(),
  date: z.string(),
  odometer: z.number().nullable(),
  odometerUnreadable: z.boolean(),
  gvwrLb: z.number().nullable(),
  selfPropelled: z.boolean(),
  proceeds: proceedsSchema.nullable(),
  odometerDisclosure: odometerDecisionSchema,
  signerName: z.string().nullable(),
  signedAt: z.string().nullable(),
  recordedAt: z.string(),
})
export type TransferRecord = z.infer<typeof transferRecordSchema>

export const transferPageSchema = z.object({
  vehicleId: z.uuid(),
  state: z.string(),
  version: z.number(),
  today: z.string(),
  /** The vehicle's own odometer at intake and model year, to start the form from. */
  intakeOdometer: z.number().nullable(),
  modelYear: z.number().nullable(),
  record: transferRecordSchema.nullable(),
  /** The lien-sale gate today: a sale may not be dated before `date`, nor recorded while it is shut. */
  lienSale: lienSaleGateSchema.nullable(),
  /** Whether the transfer can still be recorded or changed (not signed, the vehicle not closed). */
  editable: z.boolean(),
})
export type TransferPage = z.infer<typeof transferPageSchema>
