// Issue 11, "Tests and figures": "counter flow from 'find the vehicle' to 'gate pass printed' in a
// scripted browser ≤ 10 interactions". The walk-in's interactions, as tests/e2e/walk-in.spec.ts counts
// them while it drives the screens (CounterTally in tests/e2e/counter.ts: each click or tap, each field
// typed in, each key pressed, each file chosen, each signature drawn). The spec fails when what it
// counted differs from these figures, so `npm run bench -- counter` (tests/bench/counter.bench.ts),
// which drives the same walk-in through the HTTP API, reports the browser's own count.

export const WALK_IN_GOAL_INTERACTIONS = 10

export type WalkInWho = 'clerk' | 'customer'
export type WalkInStep = 'find' | 'toRelease' | 'cash' | 'card' | 'claimant' | 'idPhoto' | 'handover' | 'signature' | 'releaseForm' | 'gatePass'

export const WALK_IN_INTERACTIONS: Record<WalkInWho, Partial<Record<WalkInStep, number>>> = {
  clerk: {
    // The plate typed in the top bar's search, Enter on the one match.
    find: 2,
    // "Move to…", then its button (the one move an office clerk may make from Arrival is chosen already).
    toRelease: 2,
    // "Take a payment" (cash is the dialog's first choice), the amount, the cash handed over, "Record the payment".
    cash: 4,
    // "Card on the payment page" (it offers what is still due), "Open the payment page".
    card: 2,
    // "Record who is collecting", name, ID number, issuer, expiry (typed, then Enter), proof of ownership, Save.
    claimant: 8,
    // "Add the ID photo", then the picture chosen (the tablet's camera).
    idPhoto: 2,
    // "Record odometer and property", the odometer reading, Save (the intake's one item starts as handed back).
    handover: 3,
    // "Sign the release", then "Save the signature" once the owner has signed.
    signature: 2,
    releaseForm: 1,
    gatePass: 1,
  },
  customer: {
    // On the payment service's hosted page: the card number, Pay.
    card: 2,
    // The owner's signature on the pad.
    signature: 1,
  },
}

export const walkInTotal = (who: WalkInWho) => Object.values(WALK_IN_INTERACTIONS[who]).reduce((n, k) => n + (k ?? 0), 0)

/**
 * The simplest walk-in, on the counter's one-screen release ("Release at the counter" on the vehicle's page,
 * src/components/releases/ReleasesCounterDialog.vue): the registered owner on record collects and pays the
 * whole balance in cash. tests/e2e/walk-in-counter.spec.ts counts it as it drives the screens and fails
 * when its count differs from these figures; `npm run bench -- counter` holds them to the goal.
 */
export const WALK_IN_COUNTER_INTERACTIONS: Record<WalkInWho, Partial<Record<WalkInStep, number>>> = {
  clerk: {
    // The plate typed in the top bar's search, Enter on the one match.
    find: 2,
    // "Release at the counter": the move to Release and the one-screen release, in one.
    toRelease: 1,
    // "Cash received: $…" (the whole balance, the cash handed over taken as the amount).
    cash: 1,
    // The ID number and its expiry (the name, the ID's issuer and the proof are filled in from the record).
    claimant: 2,
    // "Photo of the ID", then the picture chosen (the tablet's camera).
    idPhoto: 2,
    // The odometer reading (the intake's property is handed back as one line, already ticked).
    handover: 1,
    // "Release and print the gate pass": every step saved, the pass printed, the release form downloaded.
    gatePass: 1,
  },
  customer: {
    // The owner's signature on the pad.
    signature: 1,
  },
}

export const counterTotal = (who: WalkInWho) => Object.values(WALK_IN_COUNTER_INTERACTIONS[who]).reduce((n, k) => n + (k ?? 0), 0)
