/** Version of the physics code, stored with every saved result so a later re-run can be compared. */
export const WICK_CORE_VERSION = '0.1.0';
