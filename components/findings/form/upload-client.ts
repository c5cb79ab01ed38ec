"use client";

import { generateReactHelpers } from "@uploadthing/react";
import type { PhotoRouter } from "@/app/api/uploadthing/core";

// The same SDK client whichever upload service the server is configured for (real or the local fake).
export const { uploadFiles } = generateReactHelpers<PhotoRouter>({ url: "/api/uploadthing" });
