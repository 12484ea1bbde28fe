import { redirect } from "next/navigation";

/** The start page is the group's workups; the guard there sends signed-out visitors to sign in. */
export default function Home(): never {
  redirect("/workups");
}
