/** The signed-in person as the shell shows them (header, user menu). */
export type ShellUser = { id: string; name: string; email: string; isAdmin: boolean };
