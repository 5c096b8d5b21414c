export declare const CSP_DIRECTIVES: string[];
export declare const BASE_CSP: string;
export declare const PERMISSIONS_POLICY: string;
export declare const BASE_HEADERS: [string, string][];
