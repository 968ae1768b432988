/**
 * Currency codes a price or a study may use: the active codes of ISO 4217 ("Codes for the
 * representation of currencies", list one: current currencies and funds, as published by its
 * maintenance agency), without the precious metals (XAU, XAG, XPD, XPT), the bond-market units
 * (XBA–XBD), the SDR-like and testing codes (XDR, XSU, XUA, XTS) and "no currency" (XXX), which
 * are not what a fuel is paid in. The list is copied from the current published list (value from
 * memory of the 2025 edition, which adds XCG and ZWG); extend it when the agency publishes a change.
 */
import { z } from "zod";

export const ISO_4217_CODES = Object.freeze([
  "AED", "AFN", "ALL", "AMD", "ANG", "AOA", "ARS", "AUD", "AWG", "AZN", "BAM", "BBD", "BDT", "BGN", "BHD", "BIF",
  "BMD", "BND", "BOB", "BOV", "BRL", "BSD", "BTN", "BWP", "BYN", "BZD", "CAD", "CDF", "CHE", "CHF", "CHW", "CLF",
  "CLP", "CNY", "COP", "COU", "CRC", "CUP", "CVE", "CZK", "DJF", "DKK", "DOP", "DZD", "EGP", "ERN", "ETB", "EUR",
  "FJD", "FKP", "GBP", "GEL", "GHS", "GIP", "GMD", "GNF", "GTQ", "GYD", "HKD", "HNL", "HTG", "HUF", "IDR", "ILS",
  "INR", "IQD", "IRR", "ISK", "JMD", "JOD", "JPY", "KES", "KGS", "KHR", "KMF", "KPW", "KRW", "KWD", "KYD", "KZT",
  "LAK", "LBP", "LKR", "LRD", "LSL", "LYD", "MAD", "MDL", "MGA", "MKD", "MMK", "MNT", "MOP", "MRU", "MUR", "MVR",
  "MWK", "MXN", "MXV", "MYR", "MZN", "NAD", "NGN", "NIO", "NOK", "NPR", "NZD", "OMR", "PAB", "PEN", "PGK", "PHP",
  "PKR", "PLN", "PYG", "QAR", "RON", "RSD", "RUB", "RWF", "SAR", "SBD", "SCR", "SDG", "SEK", "SGD", "SHP", "SLE",
  "SOS", "SRD", "SSP", "STN", "SVC", "SYP", "SZL", "THB", "TJS", "TMT", "TND", "TOP", "TRY", "TTD", "TWD", "TZS",
  "UAH", "UGX", "USD", "USN", "UYI", "UYU", "UYW", "UZS", "VED", "VES", "VND", "VUV", "WST", "XAF", "XCD", "XCG",
  "XOF", "XPF", "YER", "ZAR", "ZMW", "ZWG",
] as const);
export type CurrencyCode = (typeof ISO_4217_CODES)[number];

const CODES: ReadonlySet<string> = new Set(ISO_4217_CODES);

export function isCurrencyCode(code: string): code is CurrencyCode {
  return CODES.has(code);
}

/** A currency field: trimmed, upper-cased, and an ISO 4217 code ("DOL" is refused naming the field). */
export const currencySchema = z
  .string({ error: "must be a currency code" })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, "must be a three-letter ISO 4217 currency code, e.g. EUR")
  .refine(isCurrencyCode, { error: (iss) => `"${String(iss.input)}" is not an ISO 4217 currency code (e.g. EUR, USD, GBP)` });
