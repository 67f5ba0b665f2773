/**
 * The built-in demo design: a 12 V lead-acid battery gauge with four bar steps on one bipolar
 * open-collector quad, in file form, so programs can open it without touching the file system.
 */
import demoFile from '../../../presets/lead-acid-12v-gauge.tapline.json';
import type { DesignFile } from './file-types';

/** File name shown for the demo in messages and title bars. */
export const DEMO_FILE_NAME = 'lead-acid-12v-gauge.tapline.json';

/** The demo design file, exactly as in `presets/`; pass it to `parseDesign`. */
export const DEMO_DESIGN_FILE: DesignFile = demoFile as DesignFile;
