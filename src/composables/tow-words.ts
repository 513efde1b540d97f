import type { TowLine } from '@shared/domain/tow'
import { i18n } from '@/i18n'

type Line = Pick<TowLine, 'label' | 'reason' | 'params'> & { code: string }
const { t, te } = i18n.global

/** A tow charge line's name in the reader's language (shared/messages tow.lines). */
export function towLineLabel(line: Line): string {
  return te(`tow.lines.labels.${line.code}`) ? t(`tow.lines.labels.${line.code}`) : line.label
}

/** Why a line costs what it does, said again from its code and numbers; a line stored without them keeps its own words. */
export function towLineReason(line: Line): string {
  const p = line.params
  switch (line.code) {
    case 'mileage': {
      if (!p) return line.reason
      const from = t(p.from === 'road' ? 'tow.lines.reasons.road' : 'tow.lines.reasons.greatCircle', { miles: p.miles })
      const included = Number(p.included) > 0 ? t('tow.lines.reasons.included', { included: p.included }) : ''
      return `${from}${included}${t('tow.lines.reasons.billed', { billed: p.billed })}`
    }
    case 'winching':
      return p ? t('tow.lines.reasons.winching', { n: p.n }, Number(p.n)) : line.reason
    default:
      return te(`tow.lines.reasons.${line.code}`) ? t(`tow.lines.reasons.${line.code}`) : line.reason
  }
}

/** Who asked for the tow. An agency that asked for its own tow is often typed as both the person and the agency: named once. */
export function askedBy(name: string | null, agency: string | null): string {
  const same = name && agency && name.trim().toLowerCase() === agency.trim().toLowerCase()
  return same ? name : [name, agency].filter(Boolean).join(', ')
}
