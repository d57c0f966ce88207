/**
 * Hides the token of set-password and reset links in mail shown on screen (the captured-mail list on /mail), so an
 * admin or supervisor reading mail in a test or demo installation can never use someone else's link.
 * @example redactPasswordLinks("… http://x/login/password/AbC…xyz …") // "… http://x/login/password/[withheld] …"
 */
export function redactPasswordLinks(text: string): string {
  return text.replace(/(\/login\/password\/)[A-Za-z0-9_-]{8,}/g, "$1[withheld: only the recipient may open this link]");
}
