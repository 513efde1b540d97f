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
