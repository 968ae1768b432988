/** The display units chosen with the unit switch (a cookie; display only). */
import { cookies } from "next/headers";
import { parseDisplayUnits, type DisplayUnits } from "@/lib/units/display";
import { UNITS_COOKIE } from "./units-cookie";

export async function displayUnits(): Promise<DisplayUnits> {
  return parseDisplayUnits((await cookies()).get(UNITS_COOKIE)?.value);
}
