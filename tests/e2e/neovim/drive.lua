-- Drives the Kernwright language server from headless Neovim (0.7 or later) as an independent LSP client:
-- diagnostics of both stages, a hover on a kernel, and a quick fix applied through the protocol.
-- Inputs (environment): KW_SERVER (server.js), KW_FILE (a .kw file to edit), KW_OUT (JSON results), KW_NODE (node).
-- Always ends Neovim: `qall!` on success, `cquit 1` on any error (written to KW_OUT as well).
local out = vim.env.KW_OUT
local results = { steps = {} }

local function write()
  local f = assert(io.open(out, 'w'))
  f:write(vim.fn.json_encode(results))
  f:close()
end

local function step(name, value)
  results.steps[#results.steps + 1] = name
  results[name] = value
  write()
end

local function codes(buf)
  local list = {}
  for _, d in ipairs(vim.diagnostic.get(buf)) do
    local code = d.code or (d.user_data and d.user_data.lsp and d.user_data.lsp.code)
    list[#list + 1] = tostring(code)
  end
  table.sort(list)
  return list
end

local function has(list, code)
  for _, c in ipairs(list) do if c == code then return true end end
  return false
end

local function main()
  vim.cmd('edit ' .. vim.fn.fnameescape(vim.env.KW_FILE))
  local buf = vim.api.nvim_get_current_buf()
  vim.bo[buf].filetype = 'kernwright'
  local id = vim.lsp.start_client({
    name = 'kernwright',
    cmd = { vim.env.KW_NODE or 'node', vim.env.KW_SERVER, '--stdio' },
    root_dir = vim.fn.fnamemodify(vim.env.KW_FILE, ':h'),
    get_language_id = function() return 'kernwright' end,
  })
  assert(id, 'the server did not start')
  local client = vim.lsp.get_client_by_id(id)
  assert(vim.wait(20000, function() return client.initialized end, 20), 'the server did not initialise')
  vim.lsp.buf_attach_client(buf, id)

  -- Stage one (names) at once, stage two (the failed hermitian claim) after the numerical analysis.
  assert(vim.wait(20000, function() return has(codes(buf), 'KW201') end, 20), 'no name diagnostic')
  step('first', codes(buf))
  assert(vim.wait(60000, function() return has(codes(buf), 'KW601') end, 20), 'no numerical diagnostic')
  step('second', codes(buf))

  -- Hover on the kernel name `channel`.
  local line = vim.fn.search('^kernel channel', 'n') - 1
  local hover = vim.lsp.buf_request_sync(buf, 'textDocument/hover', {
    textDocument = { uri = vim.uri_from_bufnr(buf) }, position = { line = line, character = 9 },
  }, 20000)
  local value = ''
  for _, r in pairs(hover or {}) do
    if r.result and r.result.contents then value = r.result.contents.value or '' end
  end
  step('hover', value)

  -- Quick fix for the misspelt name: ask for code actions on its diagnostic and apply the edit.
  local target
  for _, d in ipairs(vim.diagnostic.get(buf)) do
    local code = d.code or (d.user_data and d.user_data.lsp and d.user_data.lsp.code)
    if code == 'KW201' then target = d end
  end
  assert(target, 'KW201 vanished')
  -- Neovim 0.7 keeps only some LSP fields in user_data (no range): rebuild the diagnostic from the vim one.
  local lsp_diag = {
    range = { start = { line = target.lnum, character = target.col }, ['end'] = { line = target.end_lnum, character = target.end_col } },
    code = 'KW201', message = target.message, severity = target.severity,
  }
  local actions = vim.lsp.buf_request_sync(buf, 'textDocument/codeAction', {
    textDocument = { uri = vim.uri_from_bufnr(buf) },
    range = lsp_diag.range,
    context = { diagnostics = { lsp_diag } },
  }, 20000)
  local titles, applied = {}, nil
  for _, r in pairs(actions or {}) do
    for _, a in ipairs(r.result or {}) do
      titles[#titles + 1] = a.title
      if not applied and a.edit then
        vim.lsp.util.apply_workspace_edit(a.edit, client.offset_encoding or 'utf-16')
        applied = a.title
      end
    end
  end
  step('actions', titles)
  step('applied', applied or '')
  assert(vim.wait(60000, function() return not has(codes(buf), 'KW201') end, 20), 'the fix did not remove KW201')
  step('after', codes(buf))
  step('text', table.concat(vim.api.nvim_buf_get_lines(buf, 0, -1, false), '\n'))
  vim.lsp.stop_client(id)
  vim.wait(2000, function() return vim.lsp.client_is_stopped(id) end, 20)
end

local ok, err = pcall(main)
if ok then
  results.ok = true
  write()
  vim.cmd('qall!')
else
  results.ok = false
  results.error = tostring(err)
  write()
  vim.cmd('cquit 1')
end
