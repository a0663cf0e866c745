import {createContext} from 'react';

/** The rule file's caution in force, for the screens that show it in full on request (the help's second page). */
export const CautionContext = createContext<string>('');
