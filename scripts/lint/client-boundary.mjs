// A file that starts with "use client" runs in the browser wherever it lives (app/, components/,
// hooks/), so folder globs alone cannot find every client file. This rule reads the directive.
const SERVER = /(^|\/)(lib\/server|models)(\/|$)|^server-only$/;

const isClientFile = (program) =>
  program.body.some((node) => node.type === "ExpressionStatement" && node.directive === "use client");

/** @type {import("eslint").Rule.RuleModule} */
export const clientBoundary = {
  meta: {
    type: "problem",
    docs: { description: 'A "use client" file never imports lib/server, models or server-only.' },
    messages: {
      server: '"{{source}}" is server code; a "use client" file takes types from lib/schemas or lib/domain.',
    },
    schema: [],
  },
  create(context) {
    let client = false;
    const check = (node, source) => {
      if (client && typeof source === "string" && SERVER.test(source)) {
        context.report({ node, messageId: "server", data: { source } });
      }
    };
    return {
      Program(program) {
        client = isClientFile(program);
      },
      ImportDeclaration: (node) => check(node, node.source.value),
      ExportNamedDeclaration: (node) => node.source && check(node, node.source.value),
      ExportAllDeclaration: (node) => check(node, node.source.value),
      ImportExpression: (node) => node.source.type === "Literal" && check(node, node.source.value),
    };
  },
};
