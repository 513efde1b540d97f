// DESIGN.md's palette, as pdf-lib's 0–1 RGB.
const hex = (h: string) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16) / 255) as [number, number, number]

export const PALETTE = {
  ink: hex('#1E2B33'),
  steel: hex('#3E6A8A'),
  amber: hex('#E9A23B'),
  brick: hex('#B4443A'),
  green: hex('#3F8F5A'),
  paper: hex('#F7F5F0'),
  // Secondary text: ink at about 70 %, still well above 4.5:1 on white.
  muted: hex('#55616A'),
  rule: hex('#C9CED2'),
  white: [1, 1, 1] as [number, number, number],
}
export type Colour = keyof typeof PALETTE
