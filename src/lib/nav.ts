/** the screens in the top bar; a screen is listed only once its page works */
export interface NavItem {
  href: string;
  label: string;
  /** shown only to a signed-in member */
  signedIn?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/jobs', label: 'Jobs', signedIn: true },
  { href: '/library', label: 'Library', signedIn: true },
  { href: '/team', label: 'Team', signedIn: true },
];
