import { z } from 'zod';

/*
 * GET /api/openapi.json, as http/openapi.ts builds it. The JSON Schemas inside (parameters,
 * bodies, answers) are generated from the other contracts and are open objects here: a JSON
 * Schema is itself the description.
 */

const jsonSchemaSchema = z.record(z.string(), z.unknown());
const jsonContentSchema = z.object({ 'application/json': z.object({ schema: jsonSchemaSchema }) });
const securityRequirementSchema = z.record(z.string(), z.array(z.string()));

export const openApiOperationSchema = z.object({
  tags: z.array(z.string()),
  summary: z.string(),
  /** Who may call it, in a sentence. */
  description: z.string(),
  parameters: z.array(z.object({ name: z.string(), in: z.enum(['path', 'query']), required: z.boolean(), schema: jsonSchemaSchema })),
  requestBody: z.object({ required: z.boolean(), content: jsonContentSchema }).optional(),
  /** By status code, plus `default` for the error shape. */
  responses: z.record(z.string(), z.object({ description: z.string(), content: jsonContentSchema.optional() })),
  /** Present (and empty) on public operations. */
  security: z.array(securityRequirementSchema).optional(),
});
export type OpenApiOperation = z.infer<typeof openApiOperationSchema>;

export const openApiDocumentSchema = z.object({
  openapi: z.literal('3.1.0'),
  info: z.object({ title: z.string(), version: z.string(), description: z.string() }),
  servers: z.array(z.object({ url: z.string() })),
  components: z.object({ securitySchemes: z.record(z.string(), z.record(z.string(), z.string())) }),
  security: z.array(securityRequirementSchema),
  paths: z.record(z.string(), z.partialRecord(z.enum(['get', 'post', 'patch', 'put', 'delete']), openApiOperationSchema)),
});
export type OpenApiDocument = z.infer<typeof openApiDocumentSchema>;
