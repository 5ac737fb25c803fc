using DistTree.Diagnostics;

namespace DistTree.ProjectFiles.Yaml;

/// <summary>The open collections and the signal that the text is outside the subset.</summary>
internal sealed partial class FastYamlReader
{
    /// <summary>An open collection: block (with its indentation) or flow (with what it expects next).</summary>
    private sealed class Frame
    {
        // A mapping's entries while it is open: a frame is reused, so this list grows once, and each mapping
        // gets a list of exactly its size when it closes.
        private readonly List<KeyValuePair<SourceScalar, SourceNode>> _entries = [];

        public SourceNode Node { get; private set; } = null!;

        public int Indent { get; private set; }

        public bool Indentless { get; private set; }

        /// <summary>A mapping's key whose value is still to come.</summary>
        public SourceScalar? Key { get; set; }

        /// <summary>Where an empty value would be, when the value or item has not started on its indicator's line.</summary>
        public SourceLocation? EmptyAt { get; set; }

        public FlowState State { get; set; }

        /// <summary>Makes the frame stand for a newly opened collection.</summary>
        public void Open(SourceNode node, int indent, bool indentless)
        {
            _entries.Clear();
            Node = node;
            Indent = indent;
            Indentless = indentless;
            Key = null;
            EmptyAt = null;
            State = FlowState.Entry;
        }

        public void Add(SourceNode value)
        {
            if (Node is SourceSequence sequence)
            {
                sequence.Items.Add(value);
                return;
            }

            _entries.Add(new KeyValuePair<SourceScalar, SourceNode>(Key!, value));
            Key = null;
        }

        /// <summary>The closed collection, a mapping's entries moved in at their exact number.</summary>
        public SourceNode Finish()
        {
            if (Node is SourceMapping mapping && _entries.Count > 0)
            {
                mapping.Entries.Capacity = _entries.Count;
                mapping.Entries.AddRange(_entries);
                _entries.Clear();
            }

            return Node;
        }
    }

    /// <summary>The text needs the full parser; never leaves this class.</summary>
    private sealed class NotInSubsetException : Exception
    {
    }
}
