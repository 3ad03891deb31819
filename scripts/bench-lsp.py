#!/usr/bin/env python3
"""Language-server round trips: starts `plumb lsp` as an editor does, opens a derivation, then
changes it N times (each change adds a comment line) and reports, for each text, the time from
sending it to the publish of its syntax and unit messages and to the publish of its verdicts, and
the time of hover requests. The first text apart (cold: the JVM and the algebra system start).

    scripts/bench-lsp.py [FILE] [CHANGES]     (defaults: derivations/uniform-sphere.plumb, 20)
"""
import json
import os
import statistics
import subprocess
import sys
import threading
import time
import queue

here = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
path = sys.argv[1] if len(sys.argv) > 1 else os.path.join(here, "derivations", "uniform-sphere.plumb")
changes = int(sys.argv[2]) if len(sys.argv) > 2 else 20
uri = "file://" + os.path.abspath(path)
text = open(path, encoding="utf-8").read()

server = subprocess.Popen([os.path.join(here, "plumb"), "lsp"], stdin=subprocess.PIPE, stdout=subprocess.PIPE)
messages = queue.Queue()


def reader():
    out = server.stdout
    while True:
        header = b""
        while not header.endswith(b"\r\n\r\n"):
            c = out.read(1)
            if not c:
                return
            header += c
        length = int(header.split(b"Content-Length: ")[1].split(b"\r\n")[0])
        messages.put((time.monotonic(), json.loads(out.read(length))))


threading.Thread(target=reader, daemon=True).start()


def send(message):
    body = json.dumps(message).encode("utf-8")
    server.stdin.write(b"Content-Length: %d\r\n\r\n" % len(body) + body)
    server.stdin.flush()


def wait(wanted):
    while True:
        at, m = messages.get(timeout=900)
        if wanted(m):
            return at, m


def publish_of(version, verdicts):
    def wanted(m):
        if m.get("method") != "textDocument/publishDiagnostics" or m["params"].get("version") != version:
            return False
        has = any(d.get("code") == "claim" for d in m["params"]["diagnostics"])
        return has == verdicts
    return wanted


send({"jsonrpc": "2.0", "id": 1, "method": "initialize", "params": {"capabilities": {}}})
wait(lambda m: m.get("id") == 1)
send({"jsonrpc": "2.0", "method": "initialized", "params": {}})

fast, slow, hover = [], [], []
for version in range(1, changes + 2):
    if version == 1:
        start = time.monotonic()
        send({"jsonrpc": "2.0", "method": "textDocument/didOpen", "params": {"textDocument": {
            "uri": uri, "languageId": "plumb", "version": 1, "text": text}}})
    else:
        text += "# change %d\n" % version
        start = time.monotonic()
        send({"jsonrpc": "2.0", "method": "textDocument/didChange", "params": {
            "textDocument": {"uri": uri, "version": version}, "contentChanges": [{"text": text}]}})
    at, _ = wait(publish_of(version, False))
    fast.append(at - start)
    at, _ = wait(publish_of(version, True))
    slow.append(at - start)
    start = time.monotonic()
    send({"jsonrpc": "2.0", "id": 100 + version, "method": "textDocument/hover", "params": {
        "textDocument": {"uri": uri}, "position": {"line": 10, "character": 35}}})
    at, _ = wait(lambda m, i=100 + version: m.get("id") == i)
    hover.append(at - start)

send({"jsonrpc": "2.0", "id": 2, "method": "shutdown"})
wait(lambda m: m.get("id") == 2)
send({"jsonrpc": "2.0", "method": "exit"})
server.wait(timeout=60)


def summary(name, xs):
    warm = sorted(xs[1:])
    print(f"{name}: first {xs[0]:.3f} s; then ({len(warm)}) median {statistics.median(warm):.3f} s, "
          f"min {warm[0]:.3f} s, max {warm[-1]:.3f} s")


print(f"file: {os.path.basename(path)}")
summary("text sent -> syntax and unit messages published", fast)
summary("text sent -> verdicts published (includes the 250 ms pause)", slow)
summary("hover round trip", hover)
with open("/proc/loadavg") as f:
    print("load average: " + " ".join(f.read().split()[:3]) + f" on {os.cpu_count()} cores")
