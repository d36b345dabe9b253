/** A compound id made safe as a folder name: runs of other characters become "_", no leading dot. */
export function safeName(name: string): string {
  return name.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^\.+/, '_') || '_';
}
