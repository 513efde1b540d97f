import type { Plugin } from 'vue'

// Element Plus's autocomplete points `aria-activedescendant` at "<list>-item--1" while nothing is
// highlighted, an element that never exists: a screen reader is sent nowhere and axe reports an invalid
// ARIA value (WCAG 4.1.2). One observer for the whole page removes the attribute while it names no element;
// a real highlight sets it again.
function tidy(el: Element) {
  const id = el.getAttribute('aria-activedescendant')
  if (id !== null && id !== '' && !el.ownerDocument.getElementById(id)) el.removeAttribute('aria-activedescendant')
}

export const activeDescendantFix: Plugin = {
  install() {
    if (typeof MutationObserver === 'undefined' || typeof document === 'undefined') return
    // Only that one attribute is watched: Element Plus sets it on an input already in the page.
    const observer = new MutationObserver((changes) => changes.forEach((c) => c.target instanceof Element && tidy(c.target)))
    observer.observe(document.documentElement, { subtree: true, attributes: true, attributeFilter: ['aria-activedescendant'] })
  },
}
