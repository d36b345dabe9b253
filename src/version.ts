/** Tool name and version, stamped into every output for reproducibility. Keep in step with package.json. */
export const TOOL_NAME = 'mechanist';
export const TOOL_VERSION = '0.1.0';
