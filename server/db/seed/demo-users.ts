/**
 * The invented demo people of Tamsin Bay Composites, an invented composites
 * shop. `providerId` is the id the local fake OAuth provider hands out for
 * each, so signing in as one of them finds the seeded user and its role.
 */
export interface DemoUser {
  providerId: string;
  login: string;
  name: string;
  email: string;
  role: 'viewer' | 'engineer' | 'lead' | null;
  isAdmin: boolean;
}

export const DEMO_SHOP = 'Tamsin Bay Composites';
export const DEMO_TEAM = { slug: 'tail-structures', name: 'Tail Structures Cell' };

export const DEMO_USERS: readonly DemoUser[] = [
  { providerId: '740101', login: 'ines.varga', name: 'Ines Varga', email: 'ines.varga@tamsinbay.example', role: 'viewer', isAdmin: false },
  { providerId: '740102', login: 'tomas.reed', name: 'Tomas Reed', email: 'tomas.reed@tamsinbay.example', role: 'engineer', isAdmin: false },
  { providerId: '740103', login: 'amara.okafor', name: 'Amara Okafor', email: 'amara.okafor@tamsinbay.example', role: 'lead', isAdmin: false },
  { providerId: '740104', login: 'site.admin', name: 'Wen Lindqvist', email: 'it-admin@tamsinbay.example', role: null, isAdmin: true },
];
