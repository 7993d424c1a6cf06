"use client";
// The sign-off dialog with its signature pad loads when it is opened, not with the page: the
// pad is not needed for the first paint of a placement or a visit report.
import dynamic from "next/dynamic";

export const SignOffDialog = dynamic(() => import("./sign-off-dialog").then((m) => m.SignOffDialog), { ssr: false });
