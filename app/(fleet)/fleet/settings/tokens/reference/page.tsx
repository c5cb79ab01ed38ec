// The same page as the shop's, inside the fleet portal's frame.
export { default, metadata } from "@/app/(shop)/settings/tokens/reference/page";
