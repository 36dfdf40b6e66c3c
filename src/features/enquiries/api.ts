import { useMutation } from "@tanstack/react-query";
import { post } from "../../lib/api-client.ts";
import type { EnquiryInput } from "../../../shared/schemas/enquiries.ts";

/** The buyer's enquiry (public; no session). The server answers what happens next in its own words. */
export const useSubmitEnquiry = (slug: string) =>
  useMutation({
    mutationFn: (input: EnquiryInput) => post<{ accepted: true; next: string }>(`/api/public/vehicles/${encodeURIComponent(slug)}/enquiries`, input),
  });
